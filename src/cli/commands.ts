// The list of commands, one module each. A new command adds one import and one line here.
import type { Command } from "commander";

type Register = (program: Command) => void;
const registrations: Register[] = [];

export function registerCommands(program: Command): void {
  for (const register of registrations) register(program);
}
