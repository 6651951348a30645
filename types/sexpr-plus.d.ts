// sexpr-plus ships no types; this is the shape of its parse tree (see its README).
declare module "sexpr-plus" {
  export interface Position { offset: number; line: number; column: number }
  export interface Location { start: Position; end: Position }
  export interface AtomNode { type: "atom"; content: string; location: Location }
  export interface StringNode { type: "string"; content: string; location: Location }
  export interface ListNode { type: "list"; content: Node[]; location: Location }
  export type Node = AtomNode | StringNode | ListNode;
  export class SyntaxError extends Error { location: Location }
  export function parse(input: string): Node[];
  const sexpr: { parse: typeof parse; SyntaxError: typeof SyntaxError };
  export default sexpr;
}
