// `(property …)` lists, in every spelling since KiCad 6: `(property "Name" "Value" …)` and, from
// 20241209, `(property private "Name" "Value" …)` where the bare word `private` is a flag.
import { textOf, type SList, type SNode } from "../sexpr.js";

export interface PropertyToken {
  name: string;
  value: string;
  /** The value token itself (for its character range). */
  valueNode: SNode;
}

export function readProperty(prop: SList): PropertyToken | undefined {
  let i = 1;
  const first = prop.content[1];
  if (first?.type === "atom" && first.content === "private") i = 2;
  const nameNode = prop.content[i];
  const valueNode = prop.content[i + 1];
  const name = textOf(nameNode);
  const value = textOf(valueNode);
  if (name === undefined || value === undefined || valueNode === undefined) return undefined;
  return { name, value, valueNode };
}
