// The list of commands, one module each. A new command adds one import and one line here.
import type { Command } from "commander";
import { register as bias } from "./bias.js";
import { register as check } from "./check.js";
import { register as fix } from "./fix.js";
import { register as init } from "./init.js";
import { register as nets } from "./nets.js";
import { register as rules } from "./rules.js";

type Register = (program: Command) => void;
const registrations: Register[] = [check, bias, rules, init, fix, nets];

export function registerCommands(program: Command): void {
  for (const register of registrations) register(program);
}
