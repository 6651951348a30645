#!/usr/bin/env node
import { createRequire as __loadlineCreateRequire } from 'node:module'; const require = __loadlineCreateRequire(import.meta.url);
var __create = Object.create;
var __defProp = Object.defineProperty;
var __getOwnPropDesc = Object.getOwnPropertyDescriptor;
var __getOwnPropNames = Object.getOwnPropertyNames;
var __getProtoOf = Object.getPrototypeOf;
var __hasOwnProp = Object.prototype.hasOwnProperty;
var __require = /* @__PURE__ */ ((x) => typeof require !== "undefined" ? require : typeof Proxy !== "undefined" ? new Proxy(x, {
  get: (a, b) => (typeof require !== "undefined" ? require : a)[b]
}) : x)(function(x) {
  if (typeof require !== "undefined") return require.apply(this, arguments);
  throw Error('Dynamic require of "' + x + '" is not supported');
});
var __commonJS = (cb, mod) => function __require2() {
  try {
    return mod || (0, cb[__getOwnPropNames(cb)[0]])((mod = { exports: {} }).exports, mod), mod.exports;
  } catch (e) {
    throw mod = 0, e;
  }
};
var __copyProps = (to, from, except, desc) => {
  if (from && typeof from === "object" || typeof from === "function") {
    for (let key of __getOwnPropNames(from))
      if (!__hasOwnProp.call(to, key) && key !== except)
        __defProp(to, key, { get: () => from[key], enumerable: !(desc = __getOwnPropDesc(from, key)) || desc.enumerable });
  }
  return to;
};
var __toESM = (mod, isNodeMode, target) => (target = mod != null ? __create(__getProtoOf(mod)) : {}, __copyProps(
  // If the importer is in node compatibility mode or this is not an ESM
  // file that has been converted to a CommonJS file using a Babel-
  // compatible transform (i.e. "__esModule" has not been set), then set
  // "default" to the CommonJS "module.exports" for node compatibility.
  isNodeMode || !mod || !mod.__esModule ? __defProp(target, "default", { value: mod, enumerable: true }) : target,
  mod
));

// node_modules/commander/lib/error.js
var require_error = __commonJS({
  "node_modules/commander/lib/error.js"(exports) {
    var CommanderError2 = class extends Error {
      /**
       * Constructs the CommanderError class
       * @param {number} exitCode suggested exit code which could be used with process.exit
       * @param {string} code an id string representing the error
       * @param {string} message human-readable description of the error
       */
      constructor(exitCode, code, message) {
        super(message);
        Error.captureStackTrace(this, this.constructor);
        this.name = this.constructor.name;
        this.code = code;
        this.exitCode = exitCode;
        this.nestedError = void 0;
      }
    };
    var InvalidArgumentError2 = class extends CommanderError2 {
      /**
       * Constructs the InvalidArgumentError class
       * @param {string} [message] explanation of why argument is invalid
       */
      constructor(message) {
        super(1, "commander.invalidArgument", message);
        Error.captureStackTrace(this, this.constructor);
        this.name = this.constructor.name;
      }
    };
    exports.CommanderError = CommanderError2;
    exports.InvalidArgumentError = InvalidArgumentError2;
  }
});

// node_modules/commander/lib/argument.js
var require_argument = __commonJS({
  "node_modules/commander/lib/argument.js"(exports) {
    var { InvalidArgumentError: InvalidArgumentError2 } = require_error();
    var Argument2 = class {
      /**
       * Initialize a new command argument with the given name and description.
       * The default is that the argument is required, and you can explicitly
       * indicate this with <> around the name. Put [] around the name for an optional argument.
       *
       * @param {string} name
       * @param {string} [description]
       */
      constructor(name, description) {
        this.description = description || "";
        this.variadic = false;
        this.parseArg = void 0;
        this.defaultValue = void 0;
        this.defaultValueDescription = void 0;
        this.argChoices = void 0;
        switch (name[0]) {
          case "<":
            this.required = true;
            this._name = name.slice(1, -1);
            break;
          case "[":
            this.required = false;
            this._name = name.slice(1, -1);
            break;
          default:
            this.required = true;
            this._name = name;
            break;
        }
        if (this._name.endsWith("...")) {
          this.variadic = true;
          this._name = this._name.slice(0, -3);
        }
      }
      /**
       * Return argument name.
       *
       * @return {string}
       */
      name() {
        return this._name;
      }
      /**
       * @package
       */
      _collectValue(value, previous) {
        if (previous === this.defaultValue || !Array.isArray(previous)) {
          return [value];
        }
        previous.push(value);
        return previous;
      }
      /**
       * Set the default value, and optionally supply the description to be displayed in the help.
       *
       * @param {*} value
       * @param {string} [description]
       * @return {Argument}
       */
      default(value, description) {
        this.defaultValue = value;
        this.defaultValueDescription = description;
        return this;
      }
      /**
       * Set the custom handler for processing CLI command arguments into argument values.
       *
       * @param {Function} [fn]
       * @return {Argument}
       */
      argParser(fn) {
        this.parseArg = fn;
        return this;
      }
      /**
       * Only allow argument value to be one of choices.
       *
       * @param {string[]} values
       * @return {Argument}
       */
      choices(values) {
        this.argChoices = values.slice();
        this.parseArg = (arg, previous) => {
          if (!this.argChoices.includes(arg)) {
            throw new InvalidArgumentError2(
              `Allowed choices are ${this.argChoices.join(", ")}.`
            );
          }
          if (this.variadic) {
            return this._collectValue(arg, previous);
          }
          return arg;
        };
        return this;
      }
      /**
       * Make argument required.
       *
       * @returns {Argument}
       */
      argRequired() {
        this.required = true;
        return this;
      }
      /**
       * Make argument optional.
       *
       * @returns {Argument}
       */
      argOptional() {
        this.required = false;
        return this;
      }
    };
    function humanReadableArgName(arg) {
      const nameOutput = arg.name() + (arg.variadic === true ? "..." : "");
      return arg.required ? "<" + nameOutput + ">" : "[" + nameOutput + "]";
    }
    exports.Argument = Argument2;
    exports.humanReadableArgName = humanReadableArgName;
  }
});

// node_modules/commander/lib/help.js
var require_help = __commonJS({
  "node_modules/commander/lib/help.js"(exports) {
    var { humanReadableArgName } = require_argument();
    var Help2 = class {
      constructor() {
        this.helpWidth = void 0;
        this.minWidthToWrap = 40;
        this.sortSubcommands = false;
        this.sortOptions = false;
        this.showGlobalOptions = false;
      }
      /**
       * prepareContext is called by Commander after applying overrides from `Command.configureHelp()`
       * and just before calling `formatHelp()`.
       *
       * Commander just uses the helpWidth and the rest is provided for optional use by more complex subclasses.
       *
       * @param {{ error?: boolean, helpWidth?: number, outputHasColors?: boolean }} contextOptions
       */
      prepareContext(contextOptions) {
        this.helpWidth = this.helpWidth ?? contextOptions.helpWidth ?? 80;
      }
      /**
       * Get an array of the visible subcommands. Includes a placeholder for the implicit help command, if there is one.
       *
       * @param {Command} cmd
       * @returns {Command[]}
       */
      visibleCommands(cmd) {
        const visibleCommands = cmd.commands.filter((cmd2) => !cmd2._hidden);
        const helpCommand = cmd._getHelpCommand();
        if (helpCommand && !helpCommand._hidden) {
          visibleCommands.push(helpCommand);
        }
        if (this.sortSubcommands) {
          visibleCommands.sort((a, b) => {
            return a.name().localeCompare(b.name());
          });
        }
        return visibleCommands;
      }
      /**
       * Compare options for sort.
       *
       * @param {Option} a
       * @param {Option} b
       * @returns {number}
       */
      compareOptions(a, b) {
        const getSortKey = (option) => {
          return option.short ? option.short.replace(/^-/, "") : option.long.replace(/^--/, "");
        };
        return getSortKey(a).localeCompare(getSortKey(b));
      }
      /**
       * Get an array of the visible options. Includes a placeholder for the implicit help option, if there is one.
       *
       * @param {Command} cmd
       * @returns {Option[]}
       */
      visibleOptions(cmd) {
        const visibleOptions = cmd.options.filter((option) => !option.hidden);
        const helpOption = cmd._getHelpOption();
        if (helpOption && !helpOption.hidden) {
          const removeShort = helpOption.short && cmd._findOption(helpOption.short);
          const removeLong = helpOption.long && cmd._findOption(helpOption.long);
          if (!removeShort && !removeLong) {
            visibleOptions.push(helpOption);
          } else if (helpOption.long && !removeLong) {
            visibleOptions.push(
              cmd.createOption(helpOption.long, helpOption.description)
            );
          } else if (helpOption.short && !removeShort) {
            visibleOptions.push(
              cmd.createOption(helpOption.short, helpOption.description)
            );
          }
        }
        if (this.sortOptions) {
          visibleOptions.sort(this.compareOptions);
        }
        return visibleOptions;
      }
      /**
       * Get an array of the visible global options. (Not including help.)
       *
       * @param {Command} cmd
       * @returns {Option[]}
       */
      visibleGlobalOptions(cmd) {
        if (!this.showGlobalOptions) return [];
        const globalOptions = [];
        for (let ancestorCmd = cmd.parent; ancestorCmd; ancestorCmd = ancestorCmd.parent) {
          const visibleOptions = ancestorCmd.options.filter(
            (option) => !option.hidden
          );
          globalOptions.push(...visibleOptions);
        }
        if (this.sortOptions) {
          globalOptions.sort(this.compareOptions);
        }
        return globalOptions;
      }
      /**
       * Get an array of the arguments if any have a description.
       *
       * @param {Command} cmd
       * @returns {Argument[]}
       */
      visibleArguments(cmd) {
        if (cmd._argsDescription) {
          cmd.registeredArguments.forEach((argument) => {
            argument.description = argument.description || cmd._argsDescription[argument.name()] || "";
          });
        }
        if (cmd.registeredArguments.find((argument) => argument.description)) {
          return cmd.registeredArguments;
        }
        return [];
      }
      /**
       * Get the command term to show in the list of subcommands.
       *
       * @param {Command} cmd
       * @returns {string}
       */
      subcommandTerm(cmd) {
        const args = cmd.registeredArguments.map((arg) => humanReadableArgName(arg)).join(" ");
        return cmd._name + (cmd._aliases[0] ? "|" + cmd._aliases[0] : "") + (cmd.options.length ? " [options]" : "") + // simplistic check for non-help option
        (args ? " " + args : "");
      }
      /**
       * Get the option term to show in the list of options.
       *
       * @param {Option} option
       * @returns {string}
       */
      optionTerm(option) {
        return option.flags;
      }
      /**
       * Get the argument term to show in the list of arguments.
       *
       * @param {Argument} argument
       * @returns {string}
       */
      argumentTerm(argument) {
        return argument.name();
      }
      /**
       * Get the longest command term length.
       *
       * @param {Command} cmd
       * @param {Help} helper
       * @returns {number}
       */
      longestSubcommandTermLength(cmd, helper) {
        return helper.visibleCommands(cmd).reduce((max, command) => {
          return Math.max(
            max,
            this.displayWidth(
              helper.styleSubcommandTerm(helper.subcommandTerm(command))
            )
          );
        }, 0);
      }
      /**
       * Get the longest option term length.
       *
       * @param {Command} cmd
       * @param {Help} helper
       * @returns {number}
       */
      longestOptionTermLength(cmd, helper) {
        return helper.visibleOptions(cmd).reduce((max, option) => {
          return Math.max(
            max,
            this.displayWidth(helper.styleOptionTerm(helper.optionTerm(option)))
          );
        }, 0);
      }
      /**
       * Get the longest global option term length.
       *
       * @param {Command} cmd
       * @param {Help} helper
       * @returns {number}
       */
      longestGlobalOptionTermLength(cmd, helper) {
        return helper.visibleGlobalOptions(cmd).reduce((max, option) => {
          return Math.max(
            max,
            this.displayWidth(helper.styleOptionTerm(helper.optionTerm(option)))
          );
        }, 0);
      }
      /**
       * Get the longest argument term length.
       *
       * @param {Command} cmd
       * @param {Help} helper
       * @returns {number}
       */
      longestArgumentTermLength(cmd, helper) {
        return helper.visibleArguments(cmd).reduce((max, argument) => {
          return Math.max(
            max,
            this.displayWidth(
              helper.styleArgumentTerm(helper.argumentTerm(argument))
            )
          );
        }, 0);
      }
      /**
       * Get the command usage to be displayed at the top of the built-in help.
       *
       * @param {Command} cmd
       * @returns {string}
       */
      commandUsage(cmd) {
        let cmdName = cmd._name;
        if (cmd._aliases[0]) {
          cmdName = cmdName + "|" + cmd._aliases[0];
        }
        let ancestorCmdNames = "";
        for (let ancestorCmd = cmd.parent; ancestorCmd; ancestorCmd = ancestorCmd.parent) {
          ancestorCmdNames = ancestorCmd.name() + " " + ancestorCmdNames;
        }
        return ancestorCmdNames + cmdName + " " + cmd.usage();
      }
      /**
       * Get the description for the command.
       *
       * @param {Command} cmd
       * @returns {string}
       */
      commandDescription(cmd) {
        return cmd.description();
      }
      /**
       * Get the subcommand summary to show in the list of subcommands.
       * (Fallback to description for backwards compatibility.)
       *
       * @param {Command} cmd
       * @returns {string}
       */
      subcommandDescription(cmd) {
        return cmd.summary() || cmd.description();
      }
      /**
       * Get the option description to show in the list of options.
       *
       * @param {Option} option
       * @return {string}
       */
      optionDescription(option) {
        const extraInfo = [];
        if (option.argChoices) {
          extraInfo.push(
            // use stringify to match the display of the default value
            `choices: ${option.argChoices.map((choice) => JSON.stringify(choice)).join(", ")}`
          );
        }
        if (option.defaultValue !== void 0) {
          const showDefault = option.required || option.optional || option.isBoolean() && typeof option.defaultValue === "boolean";
          if (showDefault) {
            extraInfo.push(
              `default: ${option.defaultValueDescription || JSON.stringify(option.defaultValue)}`
            );
          }
        }
        if (option.presetArg !== void 0 && option.optional) {
          extraInfo.push(`preset: ${JSON.stringify(option.presetArg)}`);
        }
        if (option.envVar !== void 0) {
          extraInfo.push(`env: ${option.envVar}`);
        }
        if (extraInfo.length > 0) {
          const extraDescription = `(${extraInfo.join(", ")})`;
          if (option.description) {
            return `${option.description} ${extraDescription}`;
          }
          return extraDescription;
        }
        return option.description;
      }
      /**
       * Get the argument description to show in the list of arguments.
       *
       * @param {Argument} argument
       * @return {string}
       */
      argumentDescription(argument) {
        const extraInfo = [];
        if (argument.argChoices) {
          extraInfo.push(
            // use stringify to match the display of the default value
            `choices: ${argument.argChoices.map((choice) => JSON.stringify(choice)).join(", ")}`
          );
        }
        if (argument.defaultValue !== void 0) {
          extraInfo.push(
            `default: ${argument.defaultValueDescription || JSON.stringify(argument.defaultValue)}`
          );
        }
        if (extraInfo.length > 0) {
          const extraDescription = `(${extraInfo.join(", ")})`;
          if (argument.description) {
            return `${argument.description} ${extraDescription}`;
          }
          return extraDescription;
        }
        return argument.description;
      }
      /**
       * Format a list of items, given a heading and an array of formatted items.
       *
       * @param {string} heading
       * @param {string[]} items
       * @param {Help} helper
       * @returns string[]
       */
      formatItemList(heading, items, helper) {
        if (items.length === 0) return [];
        return [helper.styleTitle(heading), ...items, ""];
      }
      /**
       * Group items by their help group heading.
       *
       * @param {Command[] | Option[]} unsortedItems
       * @param {Command[] | Option[]} visibleItems
       * @param {Function} getGroup
       * @returns {Map<string, Command[] | Option[]>}
       */
      groupItems(unsortedItems, visibleItems, getGroup) {
        const result = /* @__PURE__ */ new Map();
        unsortedItems.forEach((item) => {
          const group = getGroup(item);
          if (!result.has(group)) result.set(group, []);
        });
        visibleItems.forEach((item) => {
          const group = getGroup(item);
          if (!result.has(group)) {
            result.set(group, []);
          }
          result.get(group).push(item);
        });
        return result;
      }
      /**
       * Generate the built-in help text.
       *
       * @param {Command} cmd
       * @param {Help} helper
       * @returns {string}
       */
      formatHelp(cmd, helper) {
        const termWidth = helper.padWidth(cmd, helper);
        const helpWidth = helper.helpWidth ?? 80;
        function callFormatItem(term, description) {
          return helper.formatItem(term, termWidth, description, helper);
        }
        let output = [
          `${helper.styleTitle("Usage:")} ${helper.styleUsage(helper.commandUsage(cmd))}`,
          ""
        ];
        const commandDescription = helper.commandDescription(cmd);
        if (commandDescription.length > 0) {
          output = output.concat([
            helper.boxWrap(
              helper.styleCommandDescription(commandDescription),
              helpWidth
            ),
            ""
          ]);
        }
        const argumentList = helper.visibleArguments(cmd).map((argument) => {
          return callFormatItem(
            helper.styleArgumentTerm(helper.argumentTerm(argument)),
            helper.styleArgumentDescription(helper.argumentDescription(argument))
          );
        });
        output = output.concat(
          this.formatItemList("Arguments:", argumentList, helper)
        );
        const optionGroups = this.groupItems(
          cmd.options,
          helper.visibleOptions(cmd),
          (option) => option.helpGroupHeading ?? "Options:"
        );
        optionGroups.forEach((options8, group) => {
          const optionList = options8.map((option) => {
            return callFormatItem(
              helper.styleOptionTerm(helper.optionTerm(option)),
              helper.styleOptionDescription(helper.optionDescription(option))
            );
          });
          output = output.concat(this.formatItemList(group, optionList, helper));
        });
        if (helper.showGlobalOptions) {
          const globalOptionList = helper.visibleGlobalOptions(cmd).map((option) => {
            return callFormatItem(
              helper.styleOptionTerm(helper.optionTerm(option)),
              helper.styleOptionDescription(helper.optionDescription(option))
            );
          });
          output = output.concat(
            this.formatItemList("Global Options:", globalOptionList, helper)
          );
        }
        const commandGroups = this.groupItems(
          cmd.commands,
          helper.visibleCommands(cmd),
          (sub) => sub.helpGroup() || "Commands:"
        );
        commandGroups.forEach((commands, group) => {
          const commandList = commands.map((sub) => {
            return callFormatItem(
              helper.styleSubcommandTerm(helper.subcommandTerm(sub)),
              helper.styleSubcommandDescription(helper.subcommandDescription(sub))
            );
          });
          output = output.concat(this.formatItemList(group, commandList, helper));
        });
        return output.join("\n");
      }
      /**
       * Return display width of string, ignoring ANSI escape sequences. Used in padding and wrapping calculations.
       *
       * @param {string} str
       * @returns {number}
       */
      displayWidth(str) {
        return stripColor(str).length;
      }
      /**
       * Style the title for displaying in the help. Called with 'Usage:', 'Options:', etc.
       *
       * @param {string} str
       * @returns {string}
       */
      styleTitle(str) {
        return str;
      }
      styleUsage(str) {
        return str.split(" ").map((word) => {
          if (word === "[options]") return this.styleOptionText(word);
          if (word === "[command]") return this.styleSubcommandText(word);
          if (word[0] === "[" || word[0] === "<")
            return this.styleArgumentText(word);
          return this.styleCommandText(word);
        }).join(" ");
      }
      styleCommandDescription(str) {
        return this.styleDescriptionText(str);
      }
      styleOptionDescription(str) {
        return this.styleDescriptionText(str);
      }
      styleSubcommandDescription(str) {
        return this.styleDescriptionText(str);
      }
      styleArgumentDescription(str) {
        return this.styleDescriptionText(str);
      }
      styleDescriptionText(str) {
        return str;
      }
      styleOptionTerm(str) {
        return this.styleOptionText(str);
      }
      styleSubcommandTerm(str) {
        return str.split(" ").map((word) => {
          if (word === "[options]") return this.styleOptionText(word);
          if (word[0] === "[" || word[0] === "<")
            return this.styleArgumentText(word);
          return this.styleSubcommandText(word);
        }).join(" ");
      }
      styleArgumentTerm(str) {
        return this.styleArgumentText(str);
      }
      styleOptionText(str) {
        return str;
      }
      styleArgumentText(str) {
        return str;
      }
      styleSubcommandText(str) {
        return str;
      }
      styleCommandText(str) {
        return str;
      }
      /**
       * Calculate the pad width from the maximum term length.
       *
       * @param {Command} cmd
       * @param {Help} helper
       * @returns {number}
       */
      padWidth(cmd, helper) {
        return Math.max(
          helper.longestOptionTermLength(cmd, helper),
          helper.longestGlobalOptionTermLength(cmd, helper),
          helper.longestSubcommandTermLength(cmd, helper),
          helper.longestArgumentTermLength(cmd, helper)
        );
      }
      /**
       * Detect manually wrapped and indented strings by checking for line break followed by whitespace.
       *
       * @param {string} str
       * @returns {boolean}
       */
      preformatted(str) {
        return /\n[^\S\r\n]/.test(str);
      }
      /**
       * Format the "item", which consists of a term and description. Pad the term and wrap the description, indenting the following lines.
       *
       * So "TTT", 5, "DDD DDDD DD DDD" might be formatted for this.helpWidth=17 like so:
       *   TTT  DDD DDDD
       *        DD DDD
       *
       * @param {string} term
       * @param {number} termWidth
       * @param {string} description
       * @param {Help} helper
       * @returns {string}
       */
      formatItem(term, termWidth, description, helper) {
        const itemIndent = 2;
        const itemIndentStr = " ".repeat(itemIndent);
        if (!description) return itemIndentStr + term;
        const paddedTerm = term.padEnd(
          termWidth + term.length - helper.displayWidth(term)
        );
        const spacerWidth = 2;
        const helpWidth = this.helpWidth ?? 80;
        const remainingWidth = helpWidth - termWidth - spacerWidth - itemIndent;
        let formattedDescription;
        if (remainingWidth < this.minWidthToWrap || helper.preformatted(description)) {
          formattedDescription = description;
        } else {
          const wrappedDescription = helper.boxWrap(description, remainingWidth);
          formattedDescription = wrappedDescription.replace(
            /\n/g,
            "\n" + " ".repeat(termWidth + spacerWidth)
          );
        }
        return itemIndentStr + paddedTerm + " ".repeat(spacerWidth) + formattedDescription.replace(/\n/g, `
${itemIndentStr}`);
      }
      /**
       * Wrap a string at whitespace, preserving existing line breaks.
       * Wrapping is skipped if the width is less than `minWidthToWrap`.
       *
       * @param {string} str
       * @param {number} width
       * @returns {string}
       */
      boxWrap(str, width) {
        if (width < this.minWidthToWrap) return str;
        const rawLines = str.split(/\r\n|\n/);
        const chunkPattern = /[\s]*[^\s]+/g;
        const wrappedLines = [];
        rawLines.forEach((line) => {
          const chunks = line.match(chunkPattern);
          if (chunks === null) {
            wrappedLines.push("");
            return;
          }
          let sumChunks = [chunks.shift()];
          let sumWidth = this.displayWidth(sumChunks[0]);
          chunks.forEach((chunk) => {
            const visibleWidth = this.displayWidth(chunk);
            if (sumWidth + visibleWidth <= width) {
              sumChunks.push(chunk);
              sumWidth += visibleWidth;
              return;
            }
            wrappedLines.push(sumChunks.join(""));
            const nextChunk = chunk.trimStart();
            sumChunks = [nextChunk];
            sumWidth = this.displayWidth(nextChunk);
          });
          wrappedLines.push(sumChunks.join(""));
        });
        return wrappedLines.join("\n");
      }
    };
    function stripColor(str) {
      const sgrPattern = /\x1b\[\d*(;\d*)*m/g;
      return str.replace(sgrPattern, "");
    }
    exports.Help = Help2;
    exports.stripColor = stripColor;
  }
});

// node_modules/commander/lib/option.js
var require_option = __commonJS({
  "node_modules/commander/lib/option.js"(exports) {
    var { InvalidArgumentError: InvalidArgumentError2 } = require_error();
    var Option2 = class {
      /**
       * Initialize a new `Option` with the given `flags` and `description`.
       *
       * @param {string} flags
       * @param {string} [description]
       */
      constructor(flags, description) {
        this.flags = flags;
        this.description = description || "";
        this.required = flags.includes("<");
        this.optional = flags.includes("[");
        this.variadic = /\w\.\.\.[>\]]$/.test(flags);
        this.mandatory = false;
        const optionFlags = splitOptionFlags(flags);
        this.short = optionFlags.shortFlag;
        this.long = optionFlags.longFlag;
        this.negate = false;
        if (this.long) {
          this.negate = this.long.startsWith("--no-");
        }
        this.defaultValue = void 0;
        this.defaultValueDescription = void 0;
        this.presetArg = void 0;
        this.envVar = void 0;
        this.parseArg = void 0;
        this.hidden = false;
        this.argChoices = void 0;
        this.conflictsWith = [];
        this.implied = void 0;
        this.helpGroupHeading = void 0;
      }
      /**
       * Set the default value, and optionally supply the description to be displayed in the help.
       *
       * @param {*} value
       * @param {string} [description]
       * @return {Option}
       */
      default(value, description) {
        this.defaultValue = value;
        this.defaultValueDescription = description;
        return this;
      }
      /**
       * Preset to use when option used without option-argument, especially optional but also boolean and negated.
       * The custom processing (parseArg) is called.
       *
       * @example
       * new Option('--color').default('GREYSCALE').preset('RGB');
       * new Option('--donate [amount]').preset('20').argParser(parseFloat);
       *
       * @param {*} arg
       * @return {Option}
       */
      preset(arg) {
        this.presetArg = arg;
        return this;
      }
      /**
       * Add option name(s) that conflict with this option.
       * An error will be displayed if conflicting options are found during parsing.
       *
       * @example
       * new Option('--rgb').conflicts('cmyk');
       * new Option('--js').conflicts(['ts', 'jsx']);
       *
       * @param {(string | string[])} names
       * @return {Option}
       */
      conflicts(names) {
        this.conflictsWith = this.conflictsWith.concat(names);
        return this;
      }
      /**
       * Specify implied option values for when this option is set and the implied options are not.
       *
       * The custom processing (parseArg) is not called on the implied values.
       *
       * @example
       * program
       *   .addOption(new Option('--log', 'write logging information to file'))
       *   .addOption(new Option('--trace', 'log extra details').implies({ log: 'trace.txt' }));
       *
       * @param {object} impliedOptionValues
       * @return {Option}
       */
      implies(impliedOptionValues) {
        let newImplied = impliedOptionValues;
        if (typeof impliedOptionValues === "string") {
          newImplied = { [impliedOptionValues]: true };
        }
        this.implied = Object.assign(this.implied || {}, newImplied);
        return this;
      }
      /**
       * Set environment variable to check for option value.
       *
       * An environment variable is only used if when processed the current option value is
       * undefined, or the source of the current value is 'default' or 'config' or 'env'.
       *
       * @param {string} name
       * @return {Option}
       */
      env(name) {
        this.envVar = name;
        return this;
      }
      /**
       * Set the custom handler for processing CLI option arguments into option values.
       *
       * @param {Function} [fn]
       * @return {Option}
       */
      argParser(fn) {
        this.parseArg = fn;
        return this;
      }
      /**
       * Whether the option is mandatory and must have a value after parsing.
       *
       * @param {boolean} [mandatory=true]
       * @return {Option}
       */
      makeOptionMandatory(mandatory = true) {
        this.mandatory = !!mandatory;
        return this;
      }
      /**
       * Hide option in help.
       *
       * @param {boolean} [hide=true]
       * @return {Option}
       */
      hideHelp(hide = true) {
        this.hidden = !!hide;
        return this;
      }
      /**
       * @package
       */
      _collectValue(value, previous) {
        if (previous === this.defaultValue || !Array.isArray(previous)) {
          return [value];
        }
        previous.push(value);
        return previous;
      }
      /**
       * Only allow option value to be one of choices.
       *
       * @param {string[]} values
       * @return {Option}
       */
      choices(values) {
        this.argChoices = values.slice();
        this.parseArg = (arg, previous) => {
          if (!this.argChoices.includes(arg)) {
            throw new InvalidArgumentError2(
              `Allowed choices are ${this.argChoices.join(", ")}.`
            );
          }
          if (this.variadic) {
            return this._collectValue(arg, previous);
          }
          return arg;
        };
        return this;
      }
      /**
       * Return option name.
       *
       * @return {string}
       */
      name() {
        if (this.long) {
          return this.long.replace(/^--/, "");
        }
        return this.short.replace(/^-/, "");
      }
      /**
       * Return option name, in a camelcase format that can be used
       * as an object attribute key.
       *
       * @return {string}
       */
      attributeName() {
        if (this.negate) {
          return camelcase(this.name().replace(/^no-/, ""));
        }
        return camelcase(this.name());
      }
      /**
       * Set the help group heading.
       *
       * @param {string} heading
       * @return {Option}
       */
      helpGroup(heading) {
        this.helpGroupHeading = heading;
        return this;
      }
      /**
       * Check if `arg` matches the short or long flag.
       *
       * @param {string} arg
       * @return {boolean}
       * @package
       */
      is(arg) {
        return this.short === arg || this.long === arg;
      }
      /**
       * Return whether a boolean option.
       *
       * Options are one of boolean, negated, required argument, or optional argument.
       *
       * @return {boolean}
       * @package
       */
      isBoolean() {
        return !this.required && !this.optional && !this.negate;
      }
    };
    var DualOptions = class {
      /**
       * @param {Option[]} options
       */
      constructor(options8) {
        this.positiveOptions = /* @__PURE__ */ new Map();
        this.negativeOptions = /* @__PURE__ */ new Map();
        this.dualOptions = /* @__PURE__ */ new Set();
        options8.forEach((option) => {
          if (option.negate) {
            this.negativeOptions.set(option.attributeName(), option);
          } else {
            this.positiveOptions.set(option.attributeName(), option);
          }
        });
        this.negativeOptions.forEach((value, key) => {
          if (this.positiveOptions.has(key)) {
            this.dualOptions.add(key);
          }
        });
      }
      /**
       * Did the value come from the option, and not from possible matching dual option?
       *
       * @param {*} value
       * @param {Option} option
       * @returns {boolean}
       */
      valueFromOption(value, option) {
        const optionKey = option.attributeName();
        if (!this.dualOptions.has(optionKey)) return true;
        const preset = this.negativeOptions.get(optionKey).presetArg;
        const negativeValue = preset !== void 0 ? preset : false;
        return option.negate === (negativeValue === value);
      }
    };
    function camelcase(str) {
      return str.split("-").reduce((str2, word) => {
        return str2 + word[0].toUpperCase() + word.slice(1);
      });
    }
    function splitOptionFlags(flags) {
      let shortFlag;
      let longFlag;
      const shortFlagExp = /^-[^-]$/;
      const longFlagExp = /^--[^-]/;
      const flagParts = flags.split(/[ |,]+/).concat("guard");
      if (shortFlagExp.test(flagParts[0])) shortFlag = flagParts.shift();
      if (longFlagExp.test(flagParts[0])) longFlag = flagParts.shift();
      if (!shortFlag && shortFlagExp.test(flagParts[0]))
        shortFlag = flagParts.shift();
      if (!shortFlag && longFlagExp.test(flagParts[0])) {
        shortFlag = longFlag;
        longFlag = flagParts.shift();
      }
      if (flagParts[0].startsWith("-")) {
        const unsupportedFlag = flagParts[0];
        const baseError = `option creation failed due to '${unsupportedFlag}' in option flags '${flags}'`;
        if (/^-[^-][^-]/.test(unsupportedFlag))
          throw new Error(
            `${baseError}
- a short flag is a single dash and a single character
  - either use a single dash and a single character (for a short flag)
  - or use a double dash for a long option (and can have two, like '--ws, --workspace')`
          );
        if (shortFlagExp.test(unsupportedFlag))
          throw new Error(`${baseError}
- too many short flags`);
        if (longFlagExp.test(unsupportedFlag))
          throw new Error(`${baseError}
- too many long flags`);
        throw new Error(`${baseError}
- unrecognised flag format`);
      }
      if (shortFlag === void 0 && longFlag === void 0)
        throw new Error(
          `option creation failed due to no flags found in '${flags}'.`
        );
      return { shortFlag, longFlag };
    }
    exports.Option = Option2;
    exports.DualOptions = DualOptions;
  }
});

// node_modules/commander/lib/suggestSimilar.js
var require_suggestSimilar = __commonJS({
  "node_modules/commander/lib/suggestSimilar.js"(exports) {
    var maxDistance = 3;
    function editDistance2(a, b) {
      if (Math.abs(a.length - b.length) > maxDistance)
        return Math.max(a.length, b.length);
      const d = [];
      for (let i = 0; i <= a.length; i++) {
        d[i] = [i];
      }
      for (let j = 0; j <= b.length; j++) {
        d[0][j] = j;
      }
      for (let j = 1; j <= b.length; j++) {
        for (let i = 1; i <= a.length; i++) {
          let cost = 1;
          if (a[i - 1] === b[j - 1]) {
            cost = 0;
          } else {
            cost = 1;
          }
          d[i][j] = Math.min(
            d[i - 1][j] + 1,
            // deletion
            d[i][j - 1] + 1,
            // insertion
            d[i - 1][j - 1] + cost
            // substitution
          );
          if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) {
            d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
          }
        }
      }
      return d[a.length][b.length];
    }
    function suggestSimilar(word, candidates3) {
      if (!candidates3 || candidates3.length === 0) return "";
      candidates3 = Array.from(new Set(candidates3));
      const searchingOptions = word.startsWith("--");
      if (searchingOptions) {
        word = word.slice(2);
        candidates3 = candidates3.map((candidate) => candidate.slice(2));
      }
      let similar = [];
      let bestDistance = maxDistance;
      const minSimilarity = 0.4;
      candidates3.forEach((candidate) => {
        if (candidate.length <= 1) return;
        const distance = editDistance2(word, candidate);
        const length = Math.max(word.length, candidate.length);
        const similarity = (length - distance) / length;
        if (similarity > minSimilarity) {
          if (distance < bestDistance) {
            bestDistance = distance;
            similar = [candidate];
          } else if (distance === bestDistance) {
            similar.push(candidate);
          }
        }
      });
      similar.sort((a, b) => a.localeCompare(b));
      if (searchingOptions) {
        similar = similar.map((candidate) => `--${candidate}`);
      }
      if (similar.length > 1) {
        return `
(Did you mean one of ${similar.join(", ")}?)`;
      }
      if (similar.length === 1) {
        return `
(Did you mean ${similar[0]}?)`;
      }
      return "";
    }
    exports.suggestSimilar = suggestSimilar;
  }
});

// node_modules/commander/lib/command.js
var require_command = __commonJS({
  "node_modules/commander/lib/command.js"(exports) {
    var EventEmitter = __require("node:events").EventEmitter;
    var childProcess = __require("node:child_process");
    var path = __require("node:path");
    var fs = __require("node:fs");
    var process2 = __require("node:process");
    var { Argument: Argument2, humanReadableArgName } = require_argument();
    var { CommanderError: CommanderError2 } = require_error();
    var { Help: Help2, stripColor } = require_help();
    var { Option: Option2, DualOptions } = require_option();
    var { suggestSimilar } = require_suggestSimilar();
    var Command2 = class _Command extends EventEmitter {
      /**
       * Initialize a new `Command`.
       *
       * @param {string} [name]
       */
      constructor(name) {
        super();
        this.commands = [];
        this.options = [];
        this.parent = null;
        this._allowUnknownOption = false;
        this._allowExcessArguments = false;
        this.registeredArguments = [];
        this._args = this.registeredArguments;
        this.args = [];
        this.rawArgs = [];
        this.processedArgs = [];
        this._scriptPath = null;
        this._name = name || "";
        this._optionValues = {};
        this._optionValueSources = {};
        this._storeOptionsAsProperties = false;
        this._actionHandler = null;
        this._executableHandler = false;
        this._executableFile = null;
        this._executableDir = null;
        this._defaultCommandName = null;
        this._exitCallback = null;
        this._aliases = [];
        this._combineFlagAndOptionalValue = true;
        this._description = "";
        this._summary = "";
        this._argsDescription = void 0;
        this._enablePositionalOptions = false;
        this._passThroughOptions = false;
        this._lifeCycleHooks = {};
        this._showHelpAfterError = false;
        this._showSuggestionAfterError = true;
        this._savedState = null;
        this._outputConfiguration = {
          writeOut: (str) => process2.stdout.write(str),
          writeErr: (str) => process2.stderr.write(str),
          outputError: (str, write) => write(str),
          getOutHelpWidth: () => process2.stdout.isTTY ? process2.stdout.columns : void 0,
          getErrHelpWidth: () => process2.stderr.isTTY ? process2.stderr.columns : void 0,
          getOutHasColors: () => useColor() ?? (process2.stdout.isTTY && process2.stdout.hasColors?.()),
          getErrHasColors: () => useColor() ?? (process2.stderr.isTTY && process2.stderr.hasColors?.()),
          stripColor: (str) => stripColor(str)
        };
        this._hidden = false;
        this._helpOption = void 0;
        this._addImplicitHelpCommand = void 0;
        this._helpCommand = void 0;
        this._helpConfiguration = {};
        this._helpGroupHeading = void 0;
        this._defaultCommandGroup = void 0;
        this._defaultOptionGroup = void 0;
      }
      /**
       * Copy settings that are useful to have in common across root command and subcommands.
       *
       * (Used internally when adding a command using `.command()` so subcommands inherit parent settings.)
       *
       * @param {Command} sourceCommand
       * @return {Command} `this` command for chaining
       */
      copyInheritedSettings(sourceCommand) {
        this._outputConfiguration = sourceCommand._outputConfiguration;
        this._helpOption = sourceCommand._helpOption;
        this._helpCommand = sourceCommand._helpCommand;
        this._helpConfiguration = sourceCommand._helpConfiguration;
        this._exitCallback = sourceCommand._exitCallback;
        this._storeOptionsAsProperties = sourceCommand._storeOptionsAsProperties;
        this._combineFlagAndOptionalValue = sourceCommand._combineFlagAndOptionalValue;
        this._allowExcessArguments = sourceCommand._allowExcessArguments;
        this._enablePositionalOptions = sourceCommand._enablePositionalOptions;
        this._showHelpAfterError = sourceCommand._showHelpAfterError;
        this._showSuggestionAfterError = sourceCommand._showSuggestionAfterError;
        return this;
      }
      /**
       * @returns {Command[]}
       * @private
       */
      _getCommandAndAncestors() {
        const result = [];
        for (let command = this; command; command = command.parent) {
          result.push(command);
        }
        return result;
      }
      /**
       * Define a command.
       *
       * There are two styles of command: pay attention to where to put the description.
       *
       * @example
       * // Command implemented using action handler (description is supplied separately to `.command`)
       * program
       *   .command('clone <source> [destination]')
       *   .description('clone a repository into a newly created directory')
       *   .action((source, destination) => {
       *     console.log('clone command called');
       *   });
       *
       * // Command implemented using separate executable file (description is second parameter to `.command`)
       * program
       *   .command('start <service>', 'start named service')
       *   .command('stop [service]', 'stop named service, or all if no name supplied');
       *
       * @param {string} nameAndArgs - command name and arguments, args are `<required>` or `[optional]` and last may also be `variadic...`
       * @param {(object | string)} [actionOptsOrExecDesc] - configuration options (for action), or description (for executable)
       * @param {object} [execOpts] - configuration options (for executable)
       * @return {Command} returns new command for action handler, or `this` for executable command
       */
      command(nameAndArgs, actionOptsOrExecDesc, execOpts) {
        let desc = actionOptsOrExecDesc;
        let opts = execOpts;
        if (typeof desc === "object" && desc !== null) {
          opts = desc;
          desc = null;
        }
        opts = opts || {};
        const [, name, args] = nameAndArgs.match(/([^ ]+) *(.*)/);
        const cmd = this.createCommand(name);
        if (desc) {
          cmd.description(desc);
          cmd._executableHandler = true;
        }
        if (opts.isDefault) this._defaultCommandName = cmd._name;
        cmd._hidden = !!(opts.noHelp || opts.hidden);
        cmd._executableFile = opts.executableFile || null;
        if (args) cmd.arguments(args);
        this._registerCommand(cmd);
        cmd.parent = this;
        cmd.copyInheritedSettings(this);
        if (desc) return this;
        return cmd;
      }
      /**
       * Factory routine to create a new unattached command.
       *
       * See .command() for creating an attached subcommand, which uses this routine to
       * create the command. You can override createCommand to customise subcommands.
       *
       * @param {string} [name]
       * @return {Command} new command
       */
      createCommand(name) {
        return new _Command(name);
      }
      /**
       * You can customise the help with a subclass of Help by overriding createHelp,
       * or by overriding Help properties using configureHelp().
       *
       * @return {Help}
       */
      createHelp() {
        return Object.assign(new Help2(), this.configureHelp());
      }
      /**
       * You can customise the help by overriding Help properties using configureHelp(),
       * or with a subclass of Help by overriding createHelp().
       *
       * @param {object} [configuration] - configuration options
       * @return {(Command | object)} `this` command for chaining, or stored configuration
       */
      configureHelp(configuration) {
        if (configuration === void 0) return this._helpConfiguration;
        this._helpConfiguration = configuration;
        return this;
      }
      /**
       * The default output goes to stdout and stderr. You can customise this for special
       * applications. You can also customise the display of errors by overriding outputError.
       *
       * The configuration properties are all functions:
       *
       *     // change how output being written, defaults to stdout and stderr
       *     writeOut(str)
       *     writeErr(str)
       *     // change how output being written for errors, defaults to writeErr
       *     outputError(str, write) // used for displaying errors and not used for displaying help
       *     // specify width for wrapping help
       *     getOutHelpWidth()
       *     getErrHelpWidth()
       *     // color support, currently only used with Help
       *     getOutHasColors()
       *     getErrHasColors()
       *     stripColor() // used to remove ANSI escape codes if output does not have colors
       *
       * @param {object} [configuration] - configuration options
       * @return {(Command | object)} `this` command for chaining, or stored configuration
       */
      configureOutput(configuration) {
        if (configuration === void 0) return this._outputConfiguration;
        this._outputConfiguration = {
          ...this._outputConfiguration,
          ...configuration
        };
        return this;
      }
      /**
       * Display the help or a custom message after an error occurs.
       *
       * @param {(boolean|string)} [displayHelp]
       * @return {Command} `this` command for chaining
       */
      showHelpAfterError(displayHelp = true) {
        if (typeof displayHelp !== "string") displayHelp = !!displayHelp;
        this._showHelpAfterError = displayHelp;
        return this;
      }
      /**
       * Display suggestion of similar commands for unknown commands, or options for unknown options.
       *
       * @param {boolean} [displaySuggestion]
       * @return {Command} `this` command for chaining
       */
      showSuggestionAfterError(displaySuggestion = true) {
        this._showSuggestionAfterError = !!displaySuggestion;
        return this;
      }
      /**
       * Add a prepared subcommand.
       *
       * See .command() for creating an attached subcommand which inherits settings from its parent.
       *
       * @param {Command} cmd - new subcommand
       * @param {object} [opts] - configuration options
       * @return {Command} `this` command for chaining
       */
      addCommand(cmd, opts) {
        if (!cmd._name) {
          throw new Error(`Command passed to .addCommand() must have a name
- specify the name in Command constructor or using .name()`);
        }
        opts = opts || {};
        if (opts.isDefault) this._defaultCommandName = cmd._name;
        if (opts.noHelp || opts.hidden) cmd._hidden = true;
        this._registerCommand(cmd);
        cmd.parent = this;
        cmd._checkForBrokenPassThrough();
        return this;
      }
      /**
       * Factory routine to create a new unattached argument.
       *
       * See .argument() for creating an attached argument, which uses this routine to
       * create the argument. You can override createArgument to return a custom argument.
       *
       * @param {string} name
       * @param {string} [description]
       * @return {Argument} new argument
       */
      createArgument(name, description) {
        return new Argument2(name, description);
      }
      /**
       * Define argument syntax for command.
       *
       * The default is that the argument is required, and you can explicitly
       * indicate this with <> around the name. Put [] around the name for an optional argument.
       *
       * @example
       * program.argument('<input-file>');
       * program.argument('[output-file]');
       *
       * @param {string} name
       * @param {string} [description]
       * @param {(Function|*)} [parseArg] - custom argument processing function or default value
       * @param {*} [defaultValue]
       * @return {Command} `this` command for chaining
       */
      argument(name, description, parseArg, defaultValue) {
        const argument = this.createArgument(name, description);
        if (typeof parseArg === "function") {
          argument.default(defaultValue).argParser(parseArg);
        } else {
          argument.default(parseArg);
        }
        this.addArgument(argument);
        return this;
      }
      /**
       * Define argument syntax for command, adding multiple at once (without descriptions).
       *
       * See also .argument().
       *
       * @example
       * program.arguments('<cmd> [env]');
       *
       * @param {string} names
       * @return {Command} `this` command for chaining
       */
      arguments(names) {
        names.trim().split(/ +/).forEach((detail) => {
          this.argument(detail);
        });
        return this;
      }
      /**
       * Define argument syntax for command, adding a prepared argument.
       *
       * @param {Argument} argument
       * @return {Command} `this` command for chaining
       */
      addArgument(argument) {
        const previousArgument = this.registeredArguments.slice(-1)[0];
        if (previousArgument?.variadic) {
          throw new Error(
            `only the last argument can be variadic '${previousArgument.name()}'`
          );
        }
        if (argument.required && argument.defaultValue !== void 0 && argument.parseArg === void 0) {
          throw new Error(
            `a default value for a required argument is never used: '${argument.name()}'`
          );
        }
        this.registeredArguments.push(argument);
        return this;
      }
      /**
       * Customise or override default help command. By default a help command is automatically added if your command has subcommands.
       *
       * @example
       *    program.helpCommand('help [cmd]');
       *    program.helpCommand('help [cmd]', 'show help');
       *    program.helpCommand(false); // suppress default help command
       *    program.helpCommand(true); // add help command even if no subcommands
       *
       * @param {string|boolean} enableOrNameAndArgs - enable with custom name and/or arguments, or boolean to override whether added
       * @param {string} [description] - custom description
       * @return {Command} `this` command for chaining
       */
      helpCommand(enableOrNameAndArgs, description) {
        if (typeof enableOrNameAndArgs === "boolean") {
          this._addImplicitHelpCommand = enableOrNameAndArgs;
          if (enableOrNameAndArgs && this._defaultCommandGroup) {
            this._initCommandGroup(this._getHelpCommand());
          }
          return this;
        }
        const nameAndArgs = enableOrNameAndArgs ?? "help [command]";
        const [, helpName, helpArgs] = nameAndArgs.match(/([^ ]+) *(.*)/);
        const helpDescription = description ?? "display help for command";
        const helpCommand = this.createCommand(helpName);
        helpCommand.helpOption(false);
        if (helpArgs) helpCommand.arguments(helpArgs);
        if (helpDescription) helpCommand.description(helpDescription);
        this._addImplicitHelpCommand = true;
        this._helpCommand = helpCommand;
        if (enableOrNameAndArgs || description) this._initCommandGroup(helpCommand);
        return this;
      }
      /**
       * Add prepared custom help command.
       *
       * @param {(Command|string|boolean)} helpCommand - custom help command, or deprecated enableOrNameAndArgs as for `.helpCommand()`
       * @param {string} [deprecatedDescription] - deprecated custom description used with custom name only
       * @return {Command} `this` command for chaining
       */
      addHelpCommand(helpCommand, deprecatedDescription) {
        if (typeof helpCommand !== "object") {
          this.helpCommand(helpCommand, deprecatedDescription);
          return this;
        }
        this._addImplicitHelpCommand = true;
        this._helpCommand = helpCommand;
        this._initCommandGroup(helpCommand);
        return this;
      }
      /**
       * Lazy create help command.
       *
       * @return {(Command|null)}
       * @package
       */
      _getHelpCommand() {
        const hasImplicitHelpCommand = this._addImplicitHelpCommand ?? (this.commands.length && !this._actionHandler && !this._findCommand("help"));
        if (hasImplicitHelpCommand) {
          if (this._helpCommand === void 0) {
            this.helpCommand(void 0, void 0);
          }
          return this._helpCommand;
        }
        return null;
      }
      /**
       * Add hook for life cycle event.
       *
       * @param {string} event
       * @param {Function} listener
       * @return {Command} `this` command for chaining
       */
      hook(event, listener) {
        const allowedValues = ["preSubcommand", "preAction", "postAction"];
        if (!allowedValues.includes(event)) {
          throw new Error(`Unexpected value for event passed to hook : '${event}'.
Expecting one of '${allowedValues.join("', '")}'`);
        }
        if (this._lifeCycleHooks[event]) {
          this._lifeCycleHooks[event].push(listener);
        } else {
          this._lifeCycleHooks[event] = [listener];
        }
        return this;
      }
      /**
       * Register callback to use as replacement for calling process.exit.
       *
       * @param {Function} [fn] optional callback which will be passed a CommanderError, defaults to throwing
       * @return {Command} `this` command for chaining
       */
      exitOverride(fn) {
        if (fn) {
          this._exitCallback = fn;
        } else {
          this._exitCallback = (err) => {
            if (err.code !== "commander.executeSubCommandAsync") {
              throw err;
            } else {
            }
          };
        }
        return this;
      }
      /**
       * Call process.exit, and _exitCallback if defined.
       *
       * @param {number} exitCode exit code for using with process.exit
       * @param {string} code an id string representing the error
       * @param {string} message human-readable description of the error
       * @return never
       * @private
       */
      _exit(exitCode, code, message) {
        if (this._exitCallback) {
          this._exitCallback(new CommanderError2(exitCode, code, message));
        }
        process2.exit(exitCode);
      }
      /**
       * Register callback `fn` for the command.
       *
       * @example
       * program
       *   .command('serve')
       *   .description('start service')
       *   .action(function() {
       *      // do work here
       *   });
       *
       * @param {Function} fn
       * @return {Command} `this` command for chaining
       */
      action(fn) {
        const listener = (args) => {
          const expectedArgsCount = this.registeredArguments.length;
          const actionArgs = args.slice(0, expectedArgsCount);
          if (this._storeOptionsAsProperties) {
            actionArgs[expectedArgsCount] = this;
          } else {
            actionArgs[expectedArgsCount] = this.opts();
          }
          actionArgs.push(this);
          return fn.apply(this, actionArgs);
        };
        this._actionHandler = listener;
        return this;
      }
      /**
       * Factory routine to create a new unattached option.
       *
       * See .option() for creating an attached option, which uses this routine to
       * create the option. You can override createOption to return a custom option.
       *
       * @param {string} flags
       * @param {string} [description]
       * @return {Option} new option
       */
      createOption(flags, description) {
        return new Option2(flags, description);
      }
      /**
       * Wrap parseArgs to catch 'commander.invalidArgument'.
       *
       * @param {(Option | Argument)} target
       * @param {string} value
       * @param {*} previous
       * @param {string} invalidArgumentMessage
       * @private
       */
      _callParseArg(target, value, previous, invalidArgumentMessage) {
        try {
          return target.parseArg(value, previous);
        } catch (err) {
          if (err.code === "commander.invalidArgument") {
            const message = `${invalidArgumentMessage} ${err.message}`;
            this.error(message, { exitCode: err.exitCode, code: err.code });
          }
          throw err;
        }
      }
      /**
       * Check for option flag conflicts.
       * Register option if no conflicts found, or throw on conflict.
       *
       * @param {Option} option
       * @private
       */
      _registerOption(option) {
        const matchingOption = option.short && this._findOption(option.short) || option.long && this._findOption(option.long);
        if (matchingOption) {
          const matchingFlag = option.long && this._findOption(option.long) ? option.long : option.short;
          throw new Error(`Cannot add option '${option.flags}'${this._name && ` to command '${this._name}'`} due to conflicting flag '${matchingFlag}'
-  already used by option '${matchingOption.flags}'`);
        }
        this._initOptionGroup(option);
        this.options.push(option);
      }
      /**
       * Check for command name and alias conflicts with existing commands.
       * Register command if no conflicts found, or throw on conflict.
       *
       * @param {Command} command
       * @private
       */
      _registerCommand(command) {
        const knownBy = (cmd) => {
          return [cmd.name()].concat(cmd.aliases());
        };
        const alreadyUsed = knownBy(command).find(
          (name) => this._findCommand(name)
        );
        if (alreadyUsed) {
          const existingCmd = knownBy(this._findCommand(alreadyUsed)).join("|");
          const newCmd = knownBy(command).join("|");
          throw new Error(
            `cannot add command '${newCmd}' as already have command '${existingCmd}'`
          );
        }
        this._initCommandGroup(command);
        this.commands.push(command);
      }
      /**
       * Add an option.
       *
       * @param {Option} option
       * @return {Command} `this` command for chaining
       */
      addOption(option) {
        this._registerOption(option);
        const oname = option.name();
        const name = option.attributeName();
        if (option.negate) {
          const positiveLongFlag = option.long.replace(/^--no-/, "--");
          if (!this._findOption(positiveLongFlag)) {
            this.setOptionValueWithSource(
              name,
              option.defaultValue === void 0 ? true : option.defaultValue,
              "default"
            );
          }
        } else if (option.defaultValue !== void 0) {
          this.setOptionValueWithSource(name, option.defaultValue, "default");
        }
        const handleOptionValue = (val, invalidValueMessage, valueSource) => {
          if (val == null && option.presetArg !== void 0) {
            val = option.presetArg;
          }
          const oldValue = this.getOptionValue(name);
          if (val !== null && option.parseArg) {
            val = this._callParseArg(option, val, oldValue, invalidValueMessage);
          } else if (val !== null && option.variadic) {
            val = option._collectValue(val, oldValue);
          }
          if (val == null) {
            if (option.negate) {
              val = false;
            } else if (option.isBoolean() || option.optional) {
              val = true;
            } else {
              val = "";
            }
          }
          this.setOptionValueWithSource(name, val, valueSource);
        };
        this.on("option:" + oname, (val) => {
          const invalidValueMessage = `error: option '${option.flags}' argument '${val}' is invalid.`;
          handleOptionValue(val, invalidValueMessage, "cli");
        });
        if (option.envVar) {
          this.on("optionEnv:" + oname, (val) => {
            const invalidValueMessage = `error: option '${option.flags}' value '${val}' from env '${option.envVar}' is invalid.`;
            handleOptionValue(val, invalidValueMessage, "env");
          });
        }
        return this;
      }
      /**
       * Internal implementation shared by .option() and .requiredOption()
       *
       * @return {Command} `this` command for chaining
       * @private
       */
      _optionEx(config, flags, description, fn, defaultValue) {
        if (typeof flags === "object" && flags instanceof Option2) {
          throw new Error(
            "To add an Option object use addOption() instead of option() or requiredOption()"
          );
        }
        const option = this.createOption(flags, description);
        option.makeOptionMandatory(!!config.mandatory);
        if (typeof fn === "function") {
          option.default(defaultValue).argParser(fn);
        } else if (fn instanceof RegExp) {
          const regex = fn;
          fn = (val, def) => {
            const m = regex.exec(val);
            return m ? m[0] : def;
          };
          option.default(defaultValue).argParser(fn);
        } else {
          option.default(fn);
        }
        return this.addOption(option);
      }
      /**
       * Define option with `flags`, `description`, and optional argument parsing function or `defaultValue` or both.
       *
       * The `flags` string contains the short and/or long flags, separated by comma, a pipe or space. A required
       * option-argument is indicated by `<>` and an optional option-argument by `[]`.
       *
       * See the README for more details, and see also addOption() and requiredOption().
       *
       * @example
       * program
       *     .option('-p, --pepper', 'add pepper')
       *     .option('--pt, --pizza-type <TYPE>', 'type of pizza') // required option-argument
       *     .option('-c, --cheese [CHEESE]', 'add extra cheese', 'mozzarella') // optional option-argument with default
       *     .option('-t, --tip <VALUE>', 'add tip to purchase cost', parseFloat) // custom parse function
       *
       * @param {string} flags
       * @param {string} [description]
       * @param {(Function|*)} [parseArg] - custom option processing function or default value
       * @param {*} [defaultValue]
       * @return {Command} `this` command for chaining
       */
      option(flags, description, parseArg, defaultValue) {
        return this._optionEx({}, flags, description, parseArg, defaultValue);
      }
      /**
       * Add a required option which must have a value after parsing. This usually means
       * the option must be specified on the command line. (Otherwise the same as .option().)
       *
       * The `flags` string contains the short and/or long flags, separated by comma, a pipe or space.
       *
       * @param {string} flags
       * @param {string} [description]
       * @param {(Function|*)} [parseArg] - custom option processing function or default value
       * @param {*} [defaultValue]
       * @return {Command} `this` command for chaining
       */
      requiredOption(flags, description, parseArg, defaultValue) {
        return this._optionEx(
          { mandatory: true },
          flags,
          description,
          parseArg,
          defaultValue
        );
      }
      /**
       * Alter parsing of short flags with optional values.
       *
       * @example
       * // for `.option('-f,--flag [value]'):
       * program.combineFlagAndOptionalValue(true);  // `-f80` is treated like `--flag=80`, this is the default behaviour
       * program.combineFlagAndOptionalValue(false) // `-fb` is treated like `-f -b`
       *
       * @param {boolean} [combine] - if `true` or omitted, an optional value can be specified directly after the flag.
       * @return {Command} `this` command for chaining
       */
      combineFlagAndOptionalValue(combine = true) {
        this._combineFlagAndOptionalValue = !!combine;
        return this;
      }
      /**
       * Allow unknown options on the command line.
       *
       * @param {boolean} [allowUnknown] - if `true` or omitted, no error will be thrown for unknown options.
       * @return {Command} `this` command for chaining
       */
      allowUnknownOption(allowUnknown = true) {
        this._allowUnknownOption = !!allowUnknown;
        return this;
      }
      /**
       * Allow excess command-arguments on the command line. Pass false to make excess arguments an error.
       *
       * @param {boolean} [allowExcess] - if `true` or omitted, no error will be thrown for excess arguments.
       * @return {Command} `this` command for chaining
       */
      allowExcessArguments(allowExcess = true) {
        this._allowExcessArguments = !!allowExcess;
        return this;
      }
      /**
       * Enable positional options. Positional means global options are specified before subcommands which lets
       * subcommands reuse the same option names, and also enables subcommands to turn on passThroughOptions.
       * The default behaviour is non-positional and global options may appear anywhere on the command line.
       *
       * @param {boolean} [positional]
       * @return {Command} `this` command for chaining
       */
      enablePositionalOptions(positional = true) {
        this._enablePositionalOptions = !!positional;
        return this;
      }
      /**
       * Pass through options that come after command-arguments rather than treat them as command-options,
       * so actual command-options come before command-arguments. Turning this on for a subcommand requires
       * positional options to have been enabled on the program (parent commands).
       * The default behaviour is non-positional and options may appear before or after command-arguments.
       *
       * @param {boolean} [passThrough] for unknown options.
       * @return {Command} `this` command for chaining
       */
      passThroughOptions(passThrough = true) {
        this._passThroughOptions = !!passThrough;
        this._checkForBrokenPassThrough();
        return this;
      }
      /**
       * @private
       */
      _checkForBrokenPassThrough() {
        if (this.parent && this._passThroughOptions && !this.parent._enablePositionalOptions) {
          throw new Error(
            `passThroughOptions cannot be used for '${this._name}' without turning on enablePositionalOptions for parent command(s)`
          );
        }
      }
      /**
       * Whether to store option values as properties on command object,
       * or store separately (specify false). In both cases the option values can be accessed using .opts().
       *
       * @param {boolean} [storeAsProperties=true]
       * @return {Command} `this` command for chaining
       */
      storeOptionsAsProperties(storeAsProperties = true) {
        if (this.options.length) {
          throw new Error("call .storeOptionsAsProperties() before adding options");
        }
        if (Object.keys(this._optionValues).length) {
          throw new Error(
            "call .storeOptionsAsProperties() before setting option values"
          );
        }
        this._storeOptionsAsProperties = !!storeAsProperties;
        return this;
      }
      /**
       * Retrieve option value.
       *
       * @param {string} key
       * @return {object} value
       */
      getOptionValue(key) {
        if (this._storeOptionsAsProperties) {
          return this[key];
        }
        return this._optionValues[key];
      }
      /**
       * Store option value.
       *
       * @param {string} key
       * @param {object} value
       * @return {Command} `this` command for chaining
       */
      setOptionValue(key, value) {
        return this.setOptionValueWithSource(key, value, void 0);
      }
      /**
       * Store option value and where the value came from.
       *
       * @param {string} key
       * @param {object} value
       * @param {string} source - expected values are default/config/env/cli/implied
       * @return {Command} `this` command for chaining
       */
      setOptionValueWithSource(key, value, source) {
        if (this._storeOptionsAsProperties) {
          this[key] = value;
        } else {
          this._optionValues[key] = value;
        }
        this._optionValueSources[key] = source;
        return this;
      }
      /**
       * Get source of option value.
       * Expected values are default | config | env | cli | implied
       *
       * @param {string} key
       * @return {string}
       */
      getOptionValueSource(key) {
        return this._optionValueSources[key];
      }
      /**
       * Get source of option value. See also .optsWithGlobals().
       * Expected values are default | config | env | cli | implied
       *
       * @param {string} key
       * @return {string}
       */
      getOptionValueSourceWithGlobals(key) {
        let source;
        this._getCommandAndAncestors().forEach((cmd) => {
          if (cmd.getOptionValueSource(key) !== void 0) {
            source = cmd.getOptionValueSource(key);
          }
        });
        return source;
      }
      /**
       * Get user arguments from implied or explicit arguments.
       * Side-effects: set _scriptPath if args included script. Used for default program name, and subcommand searches.
       *
       * @private
       */
      _prepareUserArgs(argv, parseOptions) {
        if (argv !== void 0 && !Array.isArray(argv)) {
          throw new Error("first parameter to parse must be array or undefined");
        }
        parseOptions = parseOptions || {};
        if (argv === void 0 && parseOptions.from === void 0) {
          if (process2.versions?.electron) {
            parseOptions.from = "electron";
          }
          const execArgv = process2.execArgv ?? [];
          if (execArgv.includes("-e") || execArgv.includes("--eval") || execArgv.includes("-p") || execArgv.includes("--print")) {
            parseOptions.from = "eval";
          }
        }
        if (argv === void 0) {
          argv = process2.argv;
        }
        this.rawArgs = argv.slice();
        let userArgs;
        switch (parseOptions.from) {
          case void 0:
          case "node":
            this._scriptPath = argv[1];
            userArgs = argv.slice(2);
            break;
          case "electron":
            if (process2.defaultApp) {
              this._scriptPath = argv[1];
              userArgs = argv.slice(2);
            } else {
              userArgs = argv.slice(1);
            }
            break;
          case "user":
            userArgs = argv.slice(0);
            break;
          case "eval":
            userArgs = argv.slice(1);
            break;
          default:
            throw new Error(
              `unexpected parse option { from: '${parseOptions.from}' }`
            );
        }
        if (!this._name && this._scriptPath)
          this.nameFromFilename(this._scriptPath);
        this._name = this._name || "program";
        return userArgs;
      }
      /**
       * Parse `argv`, setting options and invoking commands when defined.
       *
       * Use parseAsync instead of parse if any of your action handlers are async.
       *
       * Call with no parameters to parse `process.argv`. Detects Electron and special node options like `node --eval`. Easy mode!
       *
       * Or call with an array of strings to parse, and optionally where the user arguments start by specifying where the arguments are `from`:
       * - `'node'`: default, `argv[0]` is the application and `argv[1]` is the script being run, with user arguments after that
       * - `'electron'`: `argv[0]` is the application and `argv[1]` varies depending on whether the electron application is packaged
       * - `'user'`: just user arguments
       *
       * @example
       * program.parse(); // parse process.argv and auto-detect electron and special node flags
       * program.parse(process.argv); // assume argv[0] is app and argv[1] is script
       * program.parse(my-args, { from: 'user' }); // just user supplied arguments, nothing special about argv[0]
       *
       * @param {string[]} [argv] - optional, defaults to process.argv
       * @param {object} [parseOptions] - optionally specify style of options with from: node/user/electron
       * @param {string} [parseOptions.from] - where the args are from: 'node', 'user', 'electron'
       * @return {Command} `this` command for chaining
       */
      parse(argv, parseOptions) {
        this._prepareForParse();
        const userArgs = this._prepareUserArgs(argv, parseOptions);
        this._parseCommand([], userArgs);
        return this;
      }
      /**
       * Parse `argv`, setting options and invoking commands when defined.
       *
       * Call with no parameters to parse `process.argv`. Detects Electron and special node options like `node --eval`. Easy mode!
       *
       * Or call with an array of strings to parse, and optionally where the user arguments start by specifying where the arguments are `from`:
       * - `'node'`: default, `argv[0]` is the application and `argv[1]` is the script being run, with user arguments after that
       * - `'electron'`: `argv[0]` is the application and `argv[1]` varies depending on whether the electron application is packaged
       * - `'user'`: just user arguments
       *
       * @example
       * await program.parseAsync(); // parse process.argv and auto-detect electron and special node flags
       * await program.parseAsync(process.argv); // assume argv[0] is app and argv[1] is script
       * await program.parseAsync(my-args, { from: 'user' }); // just user supplied arguments, nothing special about argv[0]
       *
       * @param {string[]} [argv]
       * @param {object} [parseOptions]
       * @param {string} parseOptions.from - where the args are from: 'node', 'user', 'electron'
       * @return {Promise}
       */
      async parseAsync(argv, parseOptions) {
        this._prepareForParse();
        const userArgs = this._prepareUserArgs(argv, parseOptions);
        await this._parseCommand([], userArgs);
        return this;
      }
      _prepareForParse() {
        if (this._savedState === null) {
          this.saveStateBeforeParse();
        } else {
          this.restoreStateBeforeParse();
        }
      }
      /**
       * Called the first time parse is called to save state and allow a restore before subsequent calls to parse.
       * Not usually called directly, but available for subclasses to save their custom state.
       *
       * This is called in a lazy way. Only commands used in parsing chain will have state saved.
       */
      saveStateBeforeParse() {
        this._savedState = {
          // name is stable if supplied by author, but may be unspecified for root command and deduced during parsing
          _name: this._name,
          // option values before parse have default values (including false for negated options)
          // shallow clones
          _optionValues: { ...this._optionValues },
          _optionValueSources: { ...this._optionValueSources }
        };
      }
      /**
       * Restore state before parse for calls after the first.
       * Not usually called directly, but available for subclasses to save their custom state.
       *
       * This is called in a lazy way. Only commands used in parsing chain will have state restored.
       */
      restoreStateBeforeParse() {
        if (this._storeOptionsAsProperties)
          throw new Error(`Can not call parse again when storeOptionsAsProperties is true.
- either make a new Command for each call to parse, or stop storing options as properties`);
        this._name = this._savedState._name;
        this._scriptPath = null;
        this.rawArgs = [];
        this._optionValues = { ...this._savedState._optionValues };
        this._optionValueSources = { ...this._savedState._optionValueSources };
        this.args = [];
        this.processedArgs = [];
      }
      /**
       * Throw if expected executable is missing. Add lots of help for author.
       *
       * @param {string} executableFile
       * @param {string} executableDir
       * @param {string} subcommandName
       */
      _checkForMissingExecutable(executableFile, executableDir, subcommandName) {
        if (fs.existsSync(executableFile)) return;
        const executableDirMessage = executableDir ? `searched for local subcommand relative to directory '${executableDir}'` : "no directory for search for local subcommand, use .executableDir() to supply a custom directory";
        const executableMissing = `'${executableFile}' does not exist
 - if '${subcommandName}' is not meant to be an executable command, remove description parameter from '.command()' and use '.description()' instead
 - if the default executable name is not suitable, use the executableFile option to supply a custom name or path
 - ${executableDirMessage}`;
        throw new Error(executableMissing);
      }
      /**
       * Execute a sub-command executable.
       *
       * @private
       */
      _executeSubCommand(subcommand, args) {
        args = args.slice();
        let launchWithNode = false;
        const sourceExt = [".js", ".ts", ".tsx", ".mjs", ".cjs"];
        function findFile(baseDir, baseName) {
          const localBin = path.resolve(baseDir, baseName);
          if (fs.existsSync(localBin)) return localBin;
          if (sourceExt.includes(path.extname(baseName))) return void 0;
          const foundExt = sourceExt.find(
            (ext) => fs.existsSync(`${localBin}${ext}`)
          );
          if (foundExt) return `${localBin}${foundExt}`;
          return void 0;
        }
        this._checkForMissingMandatoryOptions();
        this._checkForConflictingOptions();
        let executableFile = subcommand._executableFile || `${this._name}-${subcommand._name}`;
        let executableDir = this._executableDir || "";
        if (this._scriptPath) {
          let resolvedScriptPath;
          try {
            resolvedScriptPath = fs.realpathSync(this._scriptPath);
          } catch {
            resolvedScriptPath = this._scriptPath;
          }
          executableDir = path.resolve(
            path.dirname(resolvedScriptPath),
            executableDir
          );
        }
        if (executableDir) {
          let localFile = findFile(executableDir, executableFile);
          if (!localFile && !subcommand._executableFile && this._scriptPath) {
            const legacyName = path.basename(
              this._scriptPath,
              path.extname(this._scriptPath)
            );
            if (legacyName !== this._name) {
              localFile = findFile(
                executableDir,
                `${legacyName}-${subcommand._name}`
              );
            }
          }
          executableFile = localFile || executableFile;
        }
        launchWithNode = sourceExt.includes(path.extname(executableFile));
        let proc;
        if (process2.platform !== "win32") {
          if (launchWithNode) {
            args.unshift(executableFile);
            args = incrementNodeInspectorPort(process2.execArgv).concat(args);
            proc = childProcess.spawn(process2.argv[0], args, { stdio: "inherit" });
          } else {
            proc = childProcess.spawn(executableFile, args, { stdio: "inherit" });
          }
        } else {
          this._checkForMissingExecutable(
            executableFile,
            executableDir,
            subcommand._name
          );
          args.unshift(executableFile);
          args = incrementNodeInspectorPort(process2.execArgv).concat(args);
          proc = childProcess.spawn(process2.execPath, args, { stdio: "inherit" });
        }
        if (!proc.killed) {
          const signals = ["SIGUSR1", "SIGUSR2", "SIGTERM", "SIGINT", "SIGHUP"];
          signals.forEach((signal) => {
            process2.on(signal, () => {
              if (proc.killed === false && proc.exitCode === null) {
                proc.kill(signal);
              }
            });
          });
        }
        const exitCallback = this._exitCallback;
        proc.on("close", (code) => {
          code = code ?? 1;
          if (!exitCallback) {
            process2.exit(code);
          } else {
            exitCallback(
              new CommanderError2(
                code,
                "commander.executeSubCommandAsync",
                "(close)"
              )
            );
          }
        });
        proc.on("error", (err) => {
          if (err.code === "ENOENT") {
            this._checkForMissingExecutable(
              executableFile,
              executableDir,
              subcommand._name
            );
          } else if (err.code === "EACCES") {
            throw new Error(`'${executableFile}' not executable`);
          }
          if (!exitCallback) {
            process2.exit(1);
          } else {
            const wrappedError = new CommanderError2(
              1,
              "commander.executeSubCommandAsync",
              "(error)"
            );
            wrappedError.nestedError = err;
            exitCallback(wrappedError);
          }
        });
        this.runningCommand = proc;
      }
      /**
       * @private
       */
      _dispatchSubcommand(commandName, operands, unknown) {
        const subCommand = this._findCommand(commandName);
        if (!subCommand) this.help({ error: true });
        subCommand._prepareForParse();
        let promiseChain;
        promiseChain = this._chainOrCallSubCommandHook(
          promiseChain,
          subCommand,
          "preSubcommand"
        );
        promiseChain = this._chainOrCall(promiseChain, () => {
          if (subCommand._executableHandler) {
            this._executeSubCommand(subCommand, operands.concat(unknown));
          } else {
            return subCommand._parseCommand(operands, unknown);
          }
        });
        return promiseChain;
      }
      /**
       * Invoke help directly if possible, or dispatch if necessary.
       * e.g. help foo
       *
       * @private
       */
      _dispatchHelpCommand(subcommandName) {
        if (!subcommandName) {
          this.help();
        }
        const subCommand = this._findCommand(subcommandName);
        if (subCommand && !subCommand._executableHandler) {
          subCommand.help();
        }
        return this._dispatchSubcommand(
          subcommandName,
          [],
          [this._getHelpOption()?.long ?? this._getHelpOption()?.short ?? "--help"]
        );
      }
      /**
       * Check this.args against expected this.registeredArguments.
       *
       * @private
       */
      _checkNumberOfArguments() {
        this.registeredArguments.forEach((arg, i) => {
          if (arg.required && this.args[i] == null) {
            this.missingArgument(arg.name());
          }
        });
        if (this.registeredArguments.length > 0 && this.registeredArguments[this.registeredArguments.length - 1].variadic) {
          return;
        }
        if (this.args.length > this.registeredArguments.length) {
          this._excessArguments(this.args);
        }
      }
      /**
       * Process this.args using this.registeredArguments and save as this.processedArgs!
       *
       * @private
       */
      _processArguments() {
        const myParseArg = (argument, value, previous) => {
          let parsedValue = value;
          if (value !== null && argument.parseArg) {
            const invalidValueMessage = `error: command-argument value '${value}' is invalid for argument '${argument.name()}'.`;
            parsedValue = this._callParseArg(
              argument,
              value,
              previous,
              invalidValueMessage
            );
          }
          return parsedValue;
        };
        this._checkNumberOfArguments();
        const processedArgs = [];
        this.registeredArguments.forEach((declaredArg, index) => {
          let value = declaredArg.defaultValue;
          if (declaredArg.variadic) {
            if (index < this.args.length) {
              value = this.args.slice(index);
              if (declaredArg.parseArg) {
                value = value.reduce((processed, v) => {
                  return myParseArg(declaredArg, v, processed);
                }, declaredArg.defaultValue);
              }
            } else if (value === void 0) {
              value = [];
            }
          } else if (index < this.args.length) {
            value = this.args[index];
            if (declaredArg.parseArg) {
              value = myParseArg(declaredArg, value, declaredArg.defaultValue);
            }
          }
          processedArgs[index] = value;
        });
        this.processedArgs = processedArgs;
      }
      /**
       * Once we have a promise we chain, but call synchronously until then.
       *
       * @param {(Promise|undefined)} promise
       * @param {Function} fn
       * @return {(Promise|undefined)}
       * @private
       */
      _chainOrCall(promise, fn) {
        if (promise?.then && typeof promise.then === "function") {
          return promise.then(() => fn());
        }
        return fn();
      }
      /**
       *
       * @param {(Promise|undefined)} promise
       * @param {string} event
       * @return {(Promise|undefined)}
       * @private
       */
      _chainOrCallHooks(promise, event) {
        let result = promise;
        const hooks = [];
        this._getCommandAndAncestors().reverse().filter((cmd) => cmd._lifeCycleHooks[event] !== void 0).forEach((hookedCommand) => {
          hookedCommand._lifeCycleHooks[event].forEach((callback) => {
            hooks.push({ hookedCommand, callback });
          });
        });
        if (event === "postAction") {
          hooks.reverse();
        }
        hooks.forEach((hookDetail) => {
          result = this._chainOrCall(result, () => {
            return hookDetail.callback(hookDetail.hookedCommand, this);
          });
        });
        return result;
      }
      /**
       *
       * @param {(Promise|undefined)} promise
       * @param {Command} subCommand
       * @param {string} event
       * @return {(Promise|undefined)}
       * @private
       */
      _chainOrCallSubCommandHook(promise, subCommand, event) {
        let result = promise;
        if (this._lifeCycleHooks[event] !== void 0) {
          this._lifeCycleHooks[event].forEach((hook) => {
            result = this._chainOrCall(result, () => {
              return hook(this, subCommand);
            });
          });
        }
        return result;
      }
      /**
       * Process arguments in context of this command.
       * Returns action result, in case it is a promise.
       *
       * @private
       */
      _parseCommand(operands, unknown) {
        const parsed = this.parseOptions(unknown);
        this._parseOptionsEnv();
        this._parseOptionsImplied();
        operands = operands.concat(parsed.operands);
        unknown = parsed.unknown;
        this.args = operands.concat(unknown);
        if (operands && this._findCommand(operands[0])) {
          return this._dispatchSubcommand(operands[0], operands.slice(1), unknown);
        }
        if (this._getHelpCommand() && operands[0] === this._getHelpCommand().name()) {
          return this._dispatchHelpCommand(operands[1]);
        }
        if (this._defaultCommandName) {
          this._outputHelpIfRequested(unknown);
          return this._dispatchSubcommand(
            this._defaultCommandName,
            operands,
            unknown
          );
        }
        if (this.commands.length && this.args.length === 0 && !this._actionHandler && !this._defaultCommandName) {
          this.help({ error: true });
        }
        this._outputHelpIfRequested(parsed.unknown);
        this._checkForMissingMandatoryOptions();
        this._checkForConflictingOptions();
        const checkForUnknownOptions = () => {
          if (parsed.unknown.length > 0) {
            this.unknownOption(parsed.unknown[0]);
          }
        };
        const commandEvent = `command:${this.name()}`;
        if (this._actionHandler) {
          checkForUnknownOptions();
          this._processArguments();
          let promiseChain;
          promiseChain = this._chainOrCallHooks(promiseChain, "preAction");
          promiseChain = this._chainOrCall(
            promiseChain,
            () => this._actionHandler(this.processedArgs)
          );
          if (this.parent) {
            promiseChain = this._chainOrCall(promiseChain, () => {
              this.parent.emit(commandEvent, operands, unknown);
            });
          }
          promiseChain = this._chainOrCallHooks(promiseChain, "postAction");
          return promiseChain;
        }
        if (this.parent?.listenerCount(commandEvent)) {
          checkForUnknownOptions();
          this._processArguments();
          this.parent.emit(commandEvent, operands, unknown);
        } else if (operands.length) {
          if (this._findCommand("*")) {
            return this._dispatchSubcommand("*", operands, unknown);
          }
          if (this.listenerCount("command:*")) {
            this.emit("command:*", operands, unknown);
          } else if (this.commands.length) {
            this.unknownCommand();
          } else {
            checkForUnknownOptions();
            this._processArguments();
          }
        } else if (this.commands.length) {
          checkForUnknownOptions();
          this.help({ error: true });
        } else {
          checkForUnknownOptions();
          this._processArguments();
        }
      }
      /**
       * Find matching command.
       *
       * @private
       * @return {Command | undefined}
       */
      _findCommand(name) {
        if (!name) return void 0;
        return this.commands.find(
          (cmd) => cmd._name === name || cmd._aliases.includes(name)
        );
      }
      /**
       * Return an option matching `arg` if any.
       *
       * @param {string} arg
       * @return {Option}
       * @package
       */
      _findOption(arg) {
        return this.options.find((option) => option.is(arg));
      }
      /**
       * Display an error message if a mandatory option does not have a value.
       * Called after checking for help flags in leaf subcommand.
       *
       * @private
       */
      _checkForMissingMandatoryOptions() {
        this._getCommandAndAncestors().forEach((cmd) => {
          cmd.options.forEach((anOption) => {
            if (anOption.mandatory && cmd.getOptionValue(anOption.attributeName()) === void 0) {
              cmd.missingMandatoryOptionValue(anOption);
            }
          });
        });
      }
      /**
       * Display an error message if conflicting options are used together in this.
       *
       * @private
       */
      _checkForConflictingLocalOptions() {
        const definedNonDefaultOptions = this.options.filter((option) => {
          const optionKey = option.attributeName();
          if (this.getOptionValue(optionKey) === void 0) {
            return false;
          }
          return this.getOptionValueSource(optionKey) !== "default";
        });
        const optionsWithConflicting = definedNonDefaultOptions.filter(
          (option) => option.conflictsWith.length > 0
        );
        optionsWithConflicting.forEach((option) => {
          const conflictingAndDefined = definedNonDefaultOptions.find(
            (defined) => option.conflictsWith.includes(defined.attributeName())
          );
          if (conflictingAndDefined) {
            this._conflictingOption(option, conflictingAndDefined);
          }
        });
      }
      /**
       * Display an error message if conflicting options are used together.
       * Called after checking for help flags in leaf subcommand.
       *
       * @private
       */
      _checkForConflictingOptions() {
        this._getCommandAndAncestors().forEach((cmd) => {
          cmd._checkForConflictingLocalOptions();
        });
      }
      /**
       * Parse options from `argv` removing known options,
       * and return argv split into operands and unknown arguments.
       *
       * Side effects: modifies command by storing options. Does not reset state if called again.
       *
       * Examples:
       *
       *     argv => operands, unknown
       *     --known kkk op => [op], []
       *     op --known kkk => [op], []
       *     sub --unknown uuu op => [sub], [--unknown uuu op]
       *     sub -- --unknown uuu op => [sub --unknown uuu op], []
       *
       * @param {string[]} args
       * @return {{operands: string[], unknown: string[]}}
       */
      parseOptions(args) {
        const operands = [];
        const unknown = [];
        let dest = operands;
        function maybeOption(arg) {
          return arg.length > 1 && arg[0] === "-";
        }
        const negativeNumberArg = (arg) => {
          if (!/^-(\d+|\d*\.\d+)(e[+-]?\d+)?$/.test(arg)) return false;
          return !this._getCommandAndAncestors().some(
            (cmd) => cmd.options.map((opt) => opt.short).some((short) => /^-\d$/.test(short))
          );
        };
        let activeVariadicOption = null;
        let activeGroup = null;
        let i = 0;
        while (i < args.length || activeGroup) {
          const arg = activeGroup ?? args[i++];
          activeGroup = null;
          if (arg === "--") {
            if (dest === unknown) dest.push(arg);
            dest.push(...args.slice(i));
            break;
          }
          if (activeVariadicOption && (!maybeOption(arg) || negativeNumberArg(arg))) {
            this.emit(`option:${activeVariadicOption.name()}`, arg);
            continue;
          }
          activeVariadicOption = null;
          if (maybeOption(arg)) {
            const option = this._findOption(arg);
            if (option) {
              if (option.required) {
                const value = args[i++];
                if (value === void 0) this.optionMissingArgument(option);
                this.emit(`option:${option.name()}`, value);
              } else if (option.optional) {
                let value = null;
                if (i < args.length && (!maybeOption(args[i]) || negativeNumberArg(args[i]))) {
                  value = args[i++];
                }
                this.emit(`option:${option.name()}`, value);
              } else {
                this.emit(`option:${option.name()}`);
              }
              activeVariadicOption = option.variadic ? option : null;
              continue;
            }
          }
          if (arg.length > 2 && arg[0] === "-" && arg[1] !== "-") {
            const option = this._findOption(`-${arg[1]}`);
            if (option) {
              if (option.required || option.optional && this._combineFlagAndOptionalValue) {
                this.emit(`option:${option.name()}`, arg.slice(2));
              } else {
                this.emit(`option:${option.name()}`);
                activeGroup = `-${arg.slice(2)}`;
              }
              continue;
            }
          }
          if (/^--[^=]+=/.test(arg)) {
            const index = arg.indexOf("=");
            const option = this._findOption(arg.slice(0, index));
            if (option && (option.required || option.optional)) {
              this.emit(`option:${option.name()}`, arg.slice(index + 1));
              continue;
            }
          }
          if (dest === operands && maybeOption(arg) && !(this.commands.length === 0 && negativeNumberArg(arg))) {
            dest = unknown;
          }
          if ((this._enablePositionalOptions || this._passThroughOptions) && operands.length === 0 && unknown.length === 0) {
            if (this._findCommand(arg)) {
              operands.push(arg);
              unknown.push(...args.slice(i));
              break;
            } else if (this._getHelpCommand() && arg === this._getHelpCommand().name()) {
              operands.push(arg, ...args.slice(i));
              break;
            } else if (this._defaultCommandName) {
              unknown.push(arg, ...args.slice(i));
              break;
            }
          }
          if (this._passThroughOptions) {
            dest.push(arg, ...args.slice(i));
            break;
          }
          dest.push(arg);
        }
        return { operands, unknown };
      }
      /**
       * Return an object containing local option values as key-value pairs.
       *
       * @return {object}
       */
      opts() {
        if (this._storeOptionsAsProperties) {
          const result = {};
          const len = this.options.length;
          for (let i = 0; i < len; i++) {
            const key = this.options[i].attributeName();
            result[key] = key === this._versionOptionName ? this._version : this[key];
          }
          return result;
        }
        return this._optionValues;
      }
      /**
       * Return an object containing merged local and global option values as key-value pairs.
       *
       * @return {object}
       */
      optsWithGlobals() {
        return this._getCommandAndAncestors().reduce(
          (combinedOptions, cmd) => Object.assign(combinedOptions, cmd.opts()),
          {}
        );
      }
      /**
       * Display error message and exit (or call exitOverride).
       *
       * @param {string} message
       * @param {object} [errorOptions]
       * @param {string} [errorOptions.code] - an id string representing the error
       * @param {number} [errorOptions.exitCode] - used with process.exit
       */
      error(message, errorOptions) {
        this._outputConfiguration.outputError(
          `${message}
`,
          this._outputConfiguration.writeErr
        );
        if (typeof this._showHelpAfterError === "string") {
          this._outputConfiguration.writeErr(`${this._showHelpAfterError}
`);
        } else if (this._showHelpAfterError) {
          this._outputConfiguration.writeErr("\n");
          this.outputHelp({ error: true });
        }
        const config = errorOptions || {};
        const exitCode = config.exitCode || 1;
        const code = config.code || "commander.error";
        this._exit(exitCode, code, message);
      }
      /**
       * Apply any option related environment variables, if option does
       * not have a value from cli or client code.
       *
       * @private
       */
      _parseOptionsEnv() {
        this.options.forEach((option) => {
          if (option.envVar && option.envVar in process2.env) {
            const optionKey = option.attributeName();
            if (this.getOptionValue(optionKey) === void 0 || ["default", "config", "env"].includes(
              this.getOptionValueSource(optionKey)
            )) {
              if (option.required || option.optional) {
                this.emit(`optionEnv:${option.name()}`, process2.env[option.envVar]);
              } else {
                this.emit(`optionEnv:${option.name()}`);
              }
            }
          }
        });
      }
      /**
       * Apply any implied option values, if option is undefined or default value.
       *
       * @private
       */
      _parseOptionsImplied() {
        const dualHelper = new DualOptions(this.options);
        const hasCustomOptionValue = (optionKey) => {
          return this.getOptionValue(optionKey) !== void 0 && !["default", "implied"].includes(this.getOptionValueSource(optionKey));
        };
        this.options.filter(
          (option) => option.implied !== void 0 && hasCustomOptionValue(option.attributeName()) && dualHelper.valueFromOption(
            this.getOptionValue(option.attributeName()),
            option
          )
        ).forEach((option) => {
          Object.keys(option.implied).filter((impliedKey) => !hasCustomOptionValue(impliedKey)).forEach((impliedKey) => {
            this.setOptionValueWithSource(
              impliedKey,
              option.implied[impliedKey],
              "implied"
            );
          });
        });
      }
      /**
       * Argument `name` is missing.
       *
       * @param {string} name
       * @private
       */
      missingArgument(name) {
        const message = `error: missing required argument '${name}'`;
        this.error(message, { code: "commander.missingArgument" });
      }
      /**
       * `Option` is missing an argument.
       *
       * @param {Option} option
       * @private
       */
      optionMissingArgument(option) {
        const message = `error: option '${option.flags}' argument missing`;
        this.error(message, { code: "commander.optionMissingArgument" });
      }
      /**
       * `Option` does not have a value, and is a mandatory option.
       *
       * @param {Option} option
       * @private
       */
      missingMandatoryOptionValue(option) {
        const message = `error: required option '${option.flags}' not specified`;
        this.error(message, { code: "commander.missingMandatoryOptionValue" });
      }
      /**
       * `Option` conflicts with another option.
       *
       * @param {Option} option
       * @param {Option} conflictingOption
       * @private
       */
      _conflictingOption(option, conflictingOption) {
        const findBestOptionFromValue = (option2) => {
          const optionKey = option2.attributeName();
          const optionValue = this.getOptionValue(optionKey);
          const negativeOption = this.options.find(
            (target) => target.negate && optionKey === target.attributeName()
          );
          const positiveOption = this.options.find(
            (target) => !target.negate && optionKey === target.attributeName()
          );
          if (negativeOption && (negativeOption.presetArg === void 0 && optionValue === false || negativeOption.presetArg !== void 0 && optionValue === negativeOption.presetArg)) {
            return negativeOption;
          }
          return positiveOption || option2;
        };
        const getErrorMessage = (option2) => {
          const bestOption = findBestOptionFromValue(option2);
          const optionKey = bestOption.attributeName();
          const source = this.getOptionValueSource(optionKey);
          if (source === "env") {
            return `environment variable '${bestOption.envVar}'`;
          }
          return `option '${bestOption.flags}'`;
        };
        const message = `error: ${getErrorMessage(option)} cannot be used with ${getErrorMessage(conflictingOption)}`;
        this.error(message, { code: "commander.conflictingOption" });
      }
      /**
       * Unknown option `flag`.
       *
       * @param {string} flag
       * @private
       */
      unknownOption(flag) {
        if (this._allowUnknownOption) return;
        let suggestion = "";
        if (flag.startsWith("--") && this._showSuggestionAfterError) {
          let candidateFlags = [];
          let command = this;
          do {
            const moreFlags = command.createHelp().visibleOptions(command).filter((option) => option.long).map((option) => option.long);
            candidateFlags = candidateFlags.concat(moreFlags);
            command = command.parent;
          } while (command && !command._enablePositionalOptions);
          suggestion = suggestSimilar(flag, candidateFlags);
        }
        const message = `error: unknown option '${flag}'${suggestion}`;
        this.error(message, { code: "commander.unknownOption" });
      }
      /**
       * Excess arguments, more than expected.
       *
       * @param {string[]} receivedArgs
       * @private
       */
      _excessArguments(receivedArgs) {
        if (this._allowExcessArguments) return;
        const expected = this.registeredArguments.length;
        const s = expected === 1 ? "" : "s";
        const forSubcommand = this.parent ? ` for '${this.name()}'` : "";
        const message = `error: too many arguments${forSubcommand}. Expected ${expected} argument${s} but got ${receivedArgs.length}.`;
        this.error(message, { code: "commander.excessArguments" });
      }
      /**
       * Unknown command.
       *
       * @private
       */
      unknownCommand() {
        const unknownName = this.args[0];
        let suggestion = "";
        if (this._showSuggestionAfterError) {
          const candidateNames2 = [];
          this.createHelp().visibleCommands(this).forEach((command) => {
            candidateNames2.push(command.name());
            if (command.alias()) candidateNames2.push(command.alias());
          });
          suggestion = suggestSimilar(unknownName, candidateNames2);
        }
        const message = `error: unknown command '${unknownName}'${suggestion}`;
        this.error(message, { code: "commander.unknownCommand" });
      }
      /**
       * Get or set the program version.
       *
       * This method auto-registers the "-V, --version" option which will print the version number.
       *
       * You can optionally supply the flags and description to override the defaults.
       *
       * @param {string} [str]
       * @param {string} [flags]
       * @param {string} [description]
       * @return {(this | string | undefined)} `this` command for chaining, or version string if no arguments
       */
      version(str, flags, description) {
        if (str === void 0) return this._version;
        this._version = str;
        flags = flags || "-V, --version";
        description = description || "output the version number";
        const versionOption = this.createOption(flags, description);
        this._versionOptionName = versionOption.attributeName();
        this._registerOption(versionOption);
        this.on("option:" + versionOption.name(), () => {
          this._outputConfiguration.writeOut(`${str}
`);
          this._exit(0, "commander.version", str);
        });
        return this;
      }
      /**
       * Set the description.
       *
       * @param {string} [str]
       * @param {object} [argsDescription]
       * @return {(string|Command)}
       */
      description(str, argsDescription) {
        if (str === void 0 && argsDescription === void 0)
          return this._description;
        this._description = str;
        if (argsDescription) {
          this._argsDescription = argsDescription;
        }
        return this;
      }
      /**
       * Set the summary. Used when listed as subcommand of parent.
       *
       * @param {string} [str]
       * @return {(string|Command)}
       */
      summary(str) {
        if (str === void 0) return this._summary;
        this._summary = str;
        return this;
      }
      /**
       * Set an alias for the command.
       *
       * You may call more than once to add multiple aliases. Only the first alias is shown in the auto-generated help.
       *
       * @param {string} [alias]
       * @return {(string|Command)}
       */
      alias(alias) {
        if (alias === void 0) return this._aliases[0];
        let command = this;
        if (this.commands.length !== 0 && this.commands[this.commands.length - 1]._executableHandler) {
          command = this.commands[this.commands.length - 1];
        }
        if (alias === command._name)
          throw new Error("Command alias can't be the same as its name");
        const matchingCommand = this.parent?._findCommand(alias);
        if (matchingCommand) {
          const existingCmd = [matchingCommand.name()].concat(matchingCommand.aliases()).join("|");
          throw new Error(
            `cannot add alias '${alias}' to command '${this.name()}' as already have command '${existingCmd}'`
          );
        }
        command._aliases.push(alias);
        return this;
      }
      /**
       * Set aliases for the command.
       *
       * Only the first alias is shown in the auto-generated help.
       *
       * @param {string[]} [aliases]
       * @return {(string[]|Command)}
       */
      aliases(aliases) {
        if (aliases === void 0) return this._aliases;
        aliases.forEach((alias) => this.alias(alias));
        return this;
      }
      /**
       * Set / get the command usage `str`.
       *
       * @param {string} [str]
       * @return {(string|Command)}
       */
      usage(str) {
        if (str === void 0) {
          if (this._usage) return this._usage;
          const args = this.registeredArguments.map((arg) => {
            return humanReadableArgName(arg);
          });
          return [].concat(
            this.options.length || this._helpOption !== null ? "[options]" : [],
            this.commands.length ? "[command]" : [],
            this.registeredArguments.length ? args : []
          ).join(" ");
        }
        this._usage = str;
        return this;
      }
      /**
       * Get or set the name of the command.
       *
       * @param {string} [str]
       * @return {(string|Command)}
       */
      name(str) {
        if (str === void 0) return this._name;
        this._name = str;
        return this;
      }
      /**
       * Set/get the help group heading for this subcommand in parent command's help.
       *
       * @param {string} [heading]
       * @return {Command | string}
       */
      helpGroup(heading) {
        if (heading === void 0) return this._helpGroupHeading ?? "";
        this._helpGroupHeading = heading;
        return this;
      }
      /**
       * Set/get the default help group heading for subcommands added to this command.
       * (This does not override a group set directly on the subcommand using .helpGroup().)
       *
       * @example
       * program.commandsGroup('Development Commands:);
       * program.command('watch')...
       * program.command('lint')...
       * ...
       *
       * @param {string} [heading]
       * @returns {Command | string}
       */
      commandsGroup(heading) {
        if (heading === void 0) return this._defaultCommandGroup ?? "";
        this._defaultCommandGroup = heading;
        return this;
      }
      /**
       * Set/get the default help group heading for options added to this command.
       * (This does not override a group set directly on the option using .helpGroup().)
       *
       * @example
       * program
       *   .optionsGroup('Development Options:')
       *   .option('-d, --debug', 'output extra debugging')
       *   .option('-p, --profile', 'output profiling information')
       *
       * @param {string} [heading]
       * @returns {Command | string}
       */
      optionsGroup(heading) {
        if (heading === void 0) return this._defaultOptionGroup ?? "";
        this._defaultOptionGroup = heading;
        return this;
      }
      /**
       * @param {Option} option
       * @private
       */
      _initOptionGroup(option) {
        if (this._defaultOptionGroup && !option.helpGroupHeading)
          option.helpGroup(this._defaultOptionGroup);
      }
      /**
       * @param {Command} cmd
       * @private
       */
      _initCommandGroup(cmd) {
        if (this._defaultCommandGroup && !cmd.helpGroup())
          cmd.helpGroup(this._defaultCommandGroup);
      }
      /**
       * Set the name of the command from script filename, such as process.argv[1],
       * or require.main.filename, or __filename.
       *
       * (Used internally and public although not documented in README.)
       *
       * @example
       * program.nameFromFilename(require.main.filename);
       *
       * @param {string} filename
       * @return {Command}
       */
      nameFromFilename(filename) {
        this._name = path.basename(filename, path.extname(filename));
        return this;
      }
      /**
       * Get or set the directory for searching for executable subcommands of this command.
       *
       * @example
       * program.executableDir(__dirname);
       * // or
       * program.executableDir('subcommands');
       *
       * @param {string} [path]
       * @return {(string|null|Command)}
       */
      executableDir(path2) {
        if (path2 === void 0) return this._executableDir;
        this._executableDir = path2;
        return this;
      }
      /**
       * Return program help documentation.
       *
       * @param {{ error: boolean }} [contextOptions] - pass {error:true} to wrap for stderr instead of stdout
       * @return {string}
       */
      helpInformation(contextOptions) {
        const helper = this.createHelp();
        const context = this._getOutputContext(contextOptions);
        helper.prepareContext({
          error: context.error,
          helpWidth: context.helpWidth,
          outputHasColors: context.hasColors
        });
        const text = helper.formatHelp(this, helper);
        if (context.hasColors) return text;
        return this._outputConfiguration.stripColor(text);
      }
      /**
       * @typedef HelpContext
       * @type {object}
       * @property {boolean} error
       * @property {number} helpWidth
       * @property {boolean} hasColors
       * @property {function} write - includes stripColor if needed
       *
       * @returns {HelpContext}
       * @private
       */
      _getOutputContext(contextOptions) {
        contextOptions = contextOptions || {};
        const error = !!contextOptions.error;
        let baseWrite;
        let hasColors;
        let helpWidth;
        if (error) {
          baseWrite = (str) => this._outputConfiguration.writeErr(str);
          hasColors = this._outputConfiguration.getErrHasColors();
          helpWidth = this._outputConfiguration.getErrHelpWidth();
        } else {
          baseWrite = (str) => this._outputConfiguration.writeOut(str);
          hasColors = this._outputConfiguration.getOutHasColors();
          helpWidth = this._outputConfiguration.getOutHelpWidth();
        }
        const write = (str) => {
          if (!hasColors) str = this._outputConfiguration.stripColor(str);
          return baseWrite(str);
        };
        return { error, write, hasColors, helpWidth };
      }
      /**
       * Output help information for this command.
       *
       * Outputs built-in help, and custom text added using `.addHelpText()`.
       *
       * @param {{ error: boolean } | Function} [contextOptions] - pass {error:true} to write to stderr instead of stdout
       */
      outputHelp(contextOptions) {
        let deprecatedCallback;
        if (typeof contextOptions === "function") {
          deprecatedCallback = contextOptions;
          contextOptions = void 0;
        }
        const outputContext = this._getOutputContext(contextOptions);
        const eventContext = {
          error: outputContext.error,
          write: outputContext.write,
          command: this
        };
        this._getCommandAndAncestors().reverse().forEach((command) => command.emit("beforeAllHelp", eventContext));
        this.emit("beforeHelp", eventContext);
        let helpInformation = this.helpInformation({ error: outputContext.error });
        if (deprecatedCallback) {
          helpInformation = deprecatedCallback(helpInformation);
          if (typeof helpInformation !== "string" && !Buffer.isBuffer(helpInformation)) {
            throw new Error("outputHelp callback must return a string or a Buffer");
          }
        }
        outputContext.write(helpInformation);
        if (this._getHelpOption()?.long) {
          this.emit(this._getHelpOption().long);
        }
        this.emit("afterHelp", eventContext);
        this._getCommandAndAncestors().forEach(
          (command) => command.emit("afterAllHelp", eventContext)
        );
      }
      /**
       * You can pass in flags and a description to customise the built-in help option.
       * Pass in false to disable the built-in help option.
       *
       * @example
       * program.helpOption('-?, --help' 'show help'); // customise
       * program.helpOption(false); // disable
       *
       * @param {(string | boolean)} flags
       * @param {string} [description]
       * @return {Command} `this` command for chaining
       */
      helpOption(flags, description) {
        if (typeof flags === "boolean") {
          if (flags) {
            if (this._helpOption === null) this._helpOption = void 0;
            if (this._defaultOptionGroup) {
              this._initOptionGroup(this._getHelpOption());
            }
          } else {
            this._helpOption = null;
          }
          return this;
        }
        this._helpOption = this.createOption(
          flags ?? "-h, --help",
          description ?? "display help for command"
        );
        if (flags || description) this._initOptionGroup(this._helpOption);
        return this;
      }
      /**
       * Lazy create help option.
       * Returns null if has been disabled with .helpOption(false).
       *
       * @returns {(Option | null)} the help option
       * @package
       */
      _getHelpOption() {
        if (this._helpOption === void 0) {
          this.helpOption(void 0, void 0);
        }
        return this._helpOption;
      }
      /**
       * Supply your own option to use for the built-in help option.
       * This is an alternative to using helpOption() to customise the flags and description etc.
       *
       * @param {Option} option
       * @return {Command} `this` command for chaining
       */
      addHelpOption(option) {
        this._helpOption = option;
        this._initOptionGroup(option);
        return this;
      }
      /**
       * Output help information and exit.
       *
       * Outputs built-in help, and custom text added using `.addHelpText()`.
       *
       * @param {{ error: boolean }} [contextOptions] - pass {error:true} to write to stderr instead of stdout
       */
      help(contextOptions) {
        this.outputHelp(contextOptions);
        let exitCode = Number(process2.exitCode ?? 0);
        if (exitCode === 0 && contextOptions && typeof contextOptions !== "function" && contextOptions.error) {
          exitCode = 1;
        }
        this._exit(exitCode, "commander.help", "(outputHelp)");
      }
      /**
       * // Do a little typing to coordinate emit and listener for the help text events.
       * @typedef HelpTextEventContext
       * @type {object}
       * @property {boolean} error
       * @property {Command} command
       * @property {function} write
       */
      /**
       * Add additional text to be displayed with the built-in help.
       *
       * Position is 'before' or 'after' to affect just this command,
       * and 'beforeAll' or 'afterAll' to affect this command and all its subcommands.
       *
       * @param {string} position - before or after built-in help
       * @param {(string | Function)} text - string to add, or a function returning a string
       * @return {Command} `this` command for chaining
       */
      addHelpText(position, text) {
        const allowedValues = ["beforeAll", "before", "after", "afterAll"];
        if (!allowedValues.includes(position)) {
          throw new Error(`Unexpected value for position to addHelpText.
Expecting one of '${allowedValues.join("', '")}'`);
        }
        const helpEvent = `${position}Help`;
        this.on(helpEvent, (context) => {
          let helpStr;
          if (typeof text === "function") {
            helpStr = text({ error: context.error, command: context.command });
          } else {
            helpStr = text;
          }
          if (helpStr) {
            context.write(`${helpStr}
`);
          }
        });
        return this;
      }
      /**
       * Output help information if help flags specified
       *
       * @param {Array} args - array of options to search for help flags
       * @private
       */
      _outputHelpIfRequested(args) {
        const helpOption = this._getHelpOption();
        const helpRequested = helpOption && args.find((arg) => helpOption.is(arg));
        if (helpRequested) {
          this.outputHelp();
          this._exit(0, "commander.helpDisplayed", "(outputHelp)");
        }
      }
    };
    function incrementNodeInspectorPort(args) {
      return args.map((arg) => {
        if (!arg.startsWith("--inspect")) {
          return arg;
        }
        let debugOption;
        let debugHost = "127.0.0.1";
        let debugPort = "9229";
        let match;
        if ((match = arg.match(/^(--inspect(-brk)?)$/)) !== null) {
          debugOption = match[1];
        } else if ((match = arg.match(/^(--inspect(-brk|-port)?)=([^:]+)$/)) !== null) {
          debugOption = match[1];
          if (/^\d+$/.test(match[3])) {
            debugPort = match[3];
          } else {
            debugHost = match[3];
          }
        } else if ((match = arg.match(/^(--inspect(-brk|-port)?)=([^:]+):(\d+)$/)) !== null) {
          debugOption = match[1];
          debugHost = match[3];
          debugPort = match[4];
        }
        if (debugOption && debugPort !== "0") {
          return `${debugOption}=${debugHost}:${parseInt(debugPort) + 1}`;
        }
        return arg;
      });
    }
    function useColor() {
      if (process2.env.NO_COLOR || process2.env.FORCE_COLOR === "0" || process2.env.FORCE_COLOR === "false")
        return false;
      if (process2.env.FORCE_COLOR || process2.env.CLICOLOR_FORCE !== void 0)
        return true;
      return void 0;
    }
    exports.Command = Command2;
    exports.useColor = useColor;
  }
});

// node_modules/commander/index.js
var require_commander = __commonJS({
  "node_modules/commander/index.js"(exports) {
    var { Argument: Argument2 } = require_argument();
    var { Command: Command2 } = require_command();
    var { CommanderError: CommanderError2, InvalidArgumentError: InvalidArgumentError2 } = require_error();
    var { Help: Help2 } = require_help();
    var { Option: Option2 } = require_option();
    exports.program = new Command2();
    exports.createCommand = (name) => new Command2(name);
    exports.createOption = (flags, description) => new Option2(flags, description);
    exports.createArgument = (name, description) => new Argument2(name, description);
    exports.Command = Command2;
    exports.Option = Option2;
    exports.Argument = Argument2;
    exports.Help = Help2;
    exports.CommanderError = CommanderError2;
    exports.InvalidArgumentError = InvalidArgumentError2;
    exports.InvalidOptionArgumentError = InvalidArgumentError2;
  }
});

// node_modules/sexpr-plus/index.js
var require_sexpr_plus = __commonJS({
  "node_modules/sexpr-plus/index.js"(exports, module) {
    module.exports = (function() {
      "use strict";
      function peg$subclass(child, parent) {
        function ctor() {
          this.constructor = child;
        }
        ctor.prototype = parent.prototype;
        child.prototype = new ctor();
      }
      function peg$SyntaxError(message, expected, found, location2) {
        this.message = message;
        this.expected = expected;
        this.found = found;
        this.location = location2;
        this.name = "SyntaxError";
        if (typeof Error.captureStackTrace === "function") {
          Error.captureStackTrace(this, peg$SyntaxError);
        }
      }
      peg$subclass(peg$SyntaxError, Error);
      function peg$parse(input) {
        var options8 = arguments.length > 1 ? arguments[1] : {}, parser = this, peg$FAILED = {}, peg$startRuleFunctions = { start: peg$parsestart }, peg$startRuleFunction = peg$parsestart, peg$c0 = function(f) {
          return f;
        }, peg$c1 = { type: "other", description: "initial shebang ('#!') line" }, peg$c2 = "#!", peg$c3 = { type: "literal", value: "#!", description: '"#!"' }, peg$c4 = /^[^\n]/, peg$c5 = { type: "class", value: "[^\\n]", description: "[^\\n]" }, peg$c6 = "\n", peg$c7 = { type: "literal", value: "\n", description: '"\\n"' }, peg$c8 = { type: "any", description: "any character" }, peg$c9 = { type: "other", description: "whitespace" }, peg$c10 = " ", peg$c11 = { type: "literal", value: " ", description: '" "' }, peg$c12 = "	", peg$c13 = { type: "literal", value: "	", description: '"\\t"' }, peg$c14 = "\r", peg$c15 = { type: "literal", value: "\r", description: '"\\r"' }, peg$c16 = { type: "other", description: "comment" }, peg$c17 = ";", peg$c18 = { type: "literal", value: ";", description: '";"' }, peg$c19 = function(it) {
          return it;
        }, peg$c20 = function(q, f) {
          return outputList([q, f], location2());
        }, peg$c21 = "(", peg$c22 = { type: "literal", value: "(", description: '"("' }, peg$c23 = ")", peg$c24 = { type: "literal", value: ")", description: '")"' }, peg$c25 = function(c) {
          return outputList(c, location2());
        }, peg$c26 = { type: "other", description: "list contents" }, peg$c27 = function(first, rest) {
          return buildList(first, rest, 1);
        }, peg$c28 = "'", peg$c29 = { type: "literal", value: "'", description: `"'"` }, peg$c30 = function() {
          return outputAtom("quote", location2());
        }, peg$c31 = "`", peg$c32 = { type: "literal", value: "`", description: '"`"' }, peg$c33 = function() {
          return outputAtom("quasiquote", location2());
        }, peg$c34 = ",@", peg$c35 = { type: "literal", value: ",@", description: '",@"' }, peg$c36 = function() {
          return outputAtom("unquote-splicing", location2());
        }, peg$c37 = ",", peg$c38 = { type: "literal", value: ",", description: '","' }, peg$c39 = function() {
          return outputAtom("unquote", location2());
        }, peg$c40 = function(c) {
          return outputString(c.join(""), location2());
        }, peg$c41 = '"', peg$c42 = { type: "literal", value: '"', description: '"\\""' }, peg$c43 = "\\", peg$c44 = { type: "literal", value: "\\", description: '"\\\\"' }, peg$c45 = function(c) {
          return c;
        }, peg$c46 = /^["\\]/, peg$c47 = { type: "class", value: '["\\\\]', description: '["\\\\]' }, peg$c48 = /^[^"\\]/, peg$c49 = { type: "class", value: '[^"\\\\]', description: '[^"\\\\]' }, peg$c50 = /^[bfnrtv0]/, peg$c51 = { type: "class", value: "[bfnrtv0]", description: "[bfnrtv0]" }, peg$c52 = function(c) {
          switch (c) {
            case "b":
              return "\b";
            case "f":
              return "\f";
            case "n":
              return "\n";
            case "r":
              return "\r";
            case "t":
              return "	";
            case "v":
              return "\v";
            case "0":
              return "\0";
          }
        }, peg$c53 = function(c) {
          return c;
        }, peg$c54 = function(c) {
          return outputAtom(c.join(""), location2());
        }, peg$c55 = function(s, c) {
          return c;
        }, peg$c56 = /^[;"'`,\\()\n\t\r ]/, peg$c57 = { type: "class", value: "[;\"'`,\\\\()\\n\\t\\r ]", description: "[;\"'`,\\\\()\\n\\t\\r ]" }, peg$c58 = /^[^;"'`,\\()\n\t\r ]/, peg$c59 = { type: "class", value: "[^;\"'`,\\\\()\\n\\t\\r ]", description: "[^;\"'`,\\\\()\\n\\t\\r ]" }, peg$currPos = 0, peg$savedPos = 0, peg$posDetailsCache = [{ line: 1, column: 1, seenCR: false }], peg$maxFailPos = 0, peg$maxFailExpected = [], peg$silentFails = 0, peg$result;
        if ("startRule" in options8) {
          if (!(options8.startRule in peg$startRuleFunctions)) {
            throw new Error(`Can't start parsing from rule "` + options8.startRule + '".');
          }
          peg$startRuleFunction = peg$startRuleFunctions[options8.startRule];
        }
        function text() {
          return input.substring(peg$savedPos, peg$currPos);
        }
        function location2() {
          return peg$computeLocation(peg$savedPos, peg$currPos);
        }
        function expected(description) {
          throw peg$buildException(
            null,
            [{ type: "other", description }],
            input.substring(peg$savedPos, peg$currPos),
            peg$computeLocation(peg$savedPos, peg$currPos)
          );
        }
        function error(message) {
          throw peg$buildException(
            message,
            null,
            input.substring(peg$savedPos, peg$currPos),
            peg$computeLocation(peg$savedPos, peg$currPos)
          );
        }
        function peg$computePosDetails(pos) {
          var details = peg$posDetailsCache[pos], p, ch;
          if (details) {
            return details;
          } else {
            p = pos - 1;
            while (!peg$posDetailsCache[p]) {
              p--;
            }
            details = peg$posDetailsCache[p];
            details = {
              line: details.line,
              column: details.column,
              seenCR: details.seenCR
            };
            while (p < pos) {
              ch = input.charAt(p);
              if (ch === "\n") {
                if (!details.seenCR) {
                  details.line++;
                }
                details.column = 1;
                details.seenCR = false;
              } else if (ch === "\r" || ch === "\u2028" || ch === "\u2029") {
                details.line++;
                details.column = 1;
                details.seenCR = true;
              } else {
                details.column++;
                details.seenCR = false;
              }
              p++;
            }
            peg$posDetailsCache[pos] = details;
            return details;
          }
        }
        function peg$computeLocation(startPos, endPos) {
          var startPosDetails = peg$computePosDetails(startPos), endPosDetails = peg$computePosDetails(endPos);
          return {
            start: {
              offset: startPos,
              line: startPosDetails.line,
              column: startPosDetails.column
            },
            end: {
              offset: endPos,
              line: endPosDetails.line,
              column: endPosDetails.column
            }
          };
        }
        function peg$fail(expected2) {
          if (peg$currPos < peg$maxFailPos) {
            return;
          }
          if (peg$currPos > peg$maxFailPos) {
            peg$maxFailPos = peg$currPos;
            peg$maxFailExpected = [];
          }
          peg$maxFailExpected.push(expected2);
        }
        function peg$buildException(message, expected2, found, location3) {
          function cleanupExpected(expected3) {
            var i = 1;
            expected3.sort(function(a, b) {
              if (a.description < b.description) {
                return -1;
              } else if (a.description > b.description) {
                return 1;
              } else {
                return 0;
              }
            });
            while (i < expected3.length) {
              if (expected3[i - 1] === expected3[i]) {
                expected3.splice(i, 1);
              } else {
                i++;
              }
            }
          }
          function buildMessage(expected3, found2) {
            function stringEscape(s) {
              function hex(ch) {
                return ch.charCodeAt(0).toString(16).toUpperCase();
              }
              return s.replace(/\\/g, "\\\\").replace(/"/g, '\\"').replace(/\x08/g, "\\b").replace(/\t/g, "\\t").replace(/\n/g, "\\n").replace(/\f/g, "\\f").replace(/\r/g, "\\r").replace(/[\x00-\x07\x0B\x0E\x0F]/g, function(ch) {
                return "\\x0" + hex(ch);
              }).replace(/[\x10-\x1F\x80-\xFF]/g, function(ch) {
                return "\\x" + hex(ch);
              }).replace(/[\u0100-\u0FFF]/g, function(ch) {
                return "\\u0" + hex(ch);
              }).replace(/[\u1000-\uFFFF]/g, function(ch) {
                return "\\u" + hex(ch);
              });
            }
            var expectedDescs = new Array(expected3.length), expectedDesc, foundDesc, i;
            for (i = 0; i < expected3.length; i++) {
              expectedDescs[i] = expected3[i].description;
            }
            expectedDesc = expected3.length > 1 ? expectedDescs.slice(0, -1).join(", ") + " or " + expectedDescs[expected3.length - 1] : expectedDescs[0];
            foundDesc = found2 ? '"' + stringEscape(found2) + '"' : "end of input";
            return "Expected " + expectedDesc + " but " + foundDesc + " found.";
          }
          if (expected2 !== null) {
            cleanupExpected(expected2);
          }
          return new peg$SyntaxError(
            message !== null ? message : buildMessage(expected2, found),
            expected2,
            found,
            location3
          );
        }
        function peg$parsestart() {
          var s0, s1, s2, s3, s4;
          s0 = peg$currPos;
          s1 = peg$parseshebangLine();
          if (s1 === peg$FAILED) {
            s1 = null;
          }
          if (s1 !== peg$FAILED) {
            s2 = peg$parse_();
            if (s2 !== peg$FAILED) {
              s3 = [];
              s4 = peg$parseform();
              while (s4 !== peg$FAILED) {
                s3.push(s4);
                s4 = peg$parseform();
              }
              if (s3 !== peg$FAILED) {
                s4 = peg$parse_();
                if (s4 !== peg$FAILED) {
                  peg$savedPos = s0;
                  s1 = peg$c0(s3);
                  s0 = s1;
                } else {
                  peg$currPos = s0;
                  s0 = peg$FAILED;
                }
              } else {
                peg$currPos = s0;
                s0 = peg$FAILED;
              }
            } else {
              peg$currPos = s0;
              s0 = peg$FAILED;
            }
          } else {
            peg$currPos = s0;
            s0 = peg$FAILED;
          }
          return s0;
        }
        function peg$parseshebangLine() {
          var s0, s1, s2, s3;
          peg$silentFails++;
          s0 = peg$currPos;
          if (input.substr(peg$currPos, 2) === peg$c2) {
            s1 = peg$c2;
            peg$currPos += 2;
          } else {
            s1 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c3);
            }
          }
          if (s1 !== peg$FAILED) {
            s2 = [];
            if (peg$c4.test(input.charAt(peg$currPos))) {
              s3 = input.charAt(peg$currPos);
              peg$currPos++;
            } else {
              s3 = peg$FAILED;
              if (peg$silentFails === 0) {
                peg$fail(peg$c5);
              }
            }
            while (s3 !== peg$FAILED) {
              s2.push(s3);
              if (peg$c4.test(input.charAt(peg$currPos))) {
                s3 = input.charAt(peg$currPos);
                peg$currPos++;
              } else {
                s3 = peg$FAILED;
                if (peg$silentFails === 0) {
                  peg$fail(peg$c5);
                }
              }
            }
            if (s2 !== peg$FAILED) {
              if (input.charCodeAt(peg$currPos) === 10) {
                s3 = peg$c6;
                peg$currPos++;
              } else {
                s3 = peg$FAILED;
                if (peg$silentFails === 0) {
                  peg$fail(peg$c7);
                }
              }
              if (s3 === peg$FAILED) {
                s3 = peg$parseEOF();
              }
              if (s3 !== peg$FAILED) {
                s1 = [s1, s2, s3];
                s0 = s1;
              } else {
                peg$currPos = s0;
                s0 = peg$FAILED;
              }
            } else {
              peg$currPos = s0;
              s0 = peg$FAILED;
            }
          } else {
            peg$currPos = s0;
            s0 = peg$FAILED;
          }
          peg$silentFails--;
          if (s0 === peg$FAILED) {
            s1 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c1);
            }
          }
          return s0;
        }
        function peg$parseEOF() {
          var s0, s1;
          s0 = peg$currPos;
          peg$silentFails++;
          if (input.length > peg$currPos) {
            s1 = input.charAt(peg$currPos);
            peg$currPos++;
          } else {
            s1 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c8);
            }
          }
          peg$silentFails--;
          if (s1 === peg$FAILED) {
            s0 = void 0;
          } else {
            peg$currPos = s0;
            s0 = peg$FAILED;
          }
          return s0;
        }
        function peg$parsewhitespace() {
          var s0, s1;
          peg$silentFails++;
          s0 = [];
          if (input.charCodeAt(peg$currPos) === 32) {
            s1 = peg$c10;
            peg$currPos++;
          } else {
            s1 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c11);
            }
          }
          if (s1 === peg$FAILED) {
            if (input.charCodeAt(peg$currPos) === 9) {
              s1 = peg$c12;
              peg$currPos++;
            } else {
              s1 = peg$FAILED;
              if (peg$silentFails === 0) {
                peg$fail(peg$c13);
              }
            }
            if (s1 === peg$FAILED) {
              if (input.charCodeAt(peg$currPos) === 10) {
                s1 = peg$c6;
                peg$currPos++;
              } else {
                s1 = peg$FAILED;
                if (peg$silentFails === 0) {
                  peg$fail(peg$c7);
                }
              }
              if (s1 === peg$FAILED) {
                if (input.charCodeAt(peg$currPos) === 13) {
                  s1 = peg$c14;
                  peg$currPos++;
                } else {
                  s1 = peg$FAILED;
                  if (peg$silentFails === 0) {
                    peg$fail(peg$c15);
                  }
                }
              }
            }
          }
          if (s1 !== peg$FAILED) {
            while (s1 !== peg$FAILED) {
              s0.push(s1);
              if (input.charCodeAt(peg$currPos) === 32) {
                s1 = peg$c10;
                peg$currPos++;
              } else {
                s1 = peg$FAILED;
                if (peg$silentFails === 0) {
                  peg$fail(peg$c11);
                }
              }
              if (s1 === peg$FAILED) {
                if (input.charCodeAt(peg$currPos) === 9) {
                  s1 = peg$c12;
                  peg$currPos++;
                } else {
                  s1 = peg$FAILED;
                  if (peg$silentFails === 0) {
                    peg$fail(peg$c13);
                  }
                }
                if (s1 === peg$FAILED) {
                  if (input.charCodeAt(peg$currPos) === 10) {
                    s1 = peg$c6;
                    peg$currPos++;
                  } else {
                    s1 = peg$FAILED;
                    if (peg$silentFails === 0) {
                      peg$fail(peg$c7);
                    }
                  }
                  if (s1 === peg$FAILED) {
                    if (input.charCodeAt(peg$currPos) === 13) {
                      s1 = peg$c14;
                      peg$currPos++;
                    } else {
                      s1 = peg$FAILED;
                      if (peg$silentFails === 0) {
                        peg$fail(peg$c15);
                      }
                    }
                  }
                }
              }
            }
          } else {
            s0 = peg$FAILED;
          }
          peg$silentFails--;
          if (s0 === peg$FAILED) {
            s1 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c9);
            }
          }
          return s0;
        }
        function peg$parseendOfLineComment() {
          var s0, s1, s2, s3;
          peg$silentFails++;
          s0 = peg$currPos;
          if (input.charCodeAt(peg$currPos) === 59) {
            s1 = peg$c17;
            peg$currPos++;
          } else {
            s1 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c18);
            }
          }
          if (s1 !== peg$FAILED) {
            s2 = [];
            if (peg$c4.test(input.charAt(peg$currPos))) {
              s3 = input.charAt(peg$currPos);
              peg$currPos++;
            } else {
              s3 = peg$FAILED;
              if (peg$silentFails === 0) {
                peg$fail(peg$c5);
              }
            }
            while (s3 !== peg$FAILED) {
              s2.push(s3);
              if (peg$c4.test(input.charAt(peg$currPos))) {
                s3 = input.charAt(peg$currPos);
                peg$currPos++;
              } else {
                s3 = peg$FAILED;
                if (peg$silentFails === 0) {
                  peg$fail(peg$c5);
                }
              }
            }
            if (s2 !== peg$FAILED) {
              if (input.charCodeAt(peg$currPos) === 10) {
                s3 = peg$c6;
                peg$currPos++;
              } else {
                s3 = peg$FAILED;
                if (peg$silentFails === 0) {
                  peg$fail(peg$c7);
                }
              }
              if (s3 === peg$FAILED) {
                s3 = peg$parseEOF();
              }
              if (s3 !== peg$FAILED) {
                s1 = [s1, s2, s3];
                s0 = s1;
              } else {
                peg$currPos = s0;
                s0 = peg$FAILED;
              }
            } else {
              peg$currPos = s0;
              s0 = peg$FAILED;
            }
          } else {
            peg$currPos = s0;
            s0 = peg$FAILED;
          }
          peg$silentFails--;
          if (s0 === peg$FAILED) {
            s1 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c16);
            }
          }
          return s0;
        }
        function peg$parse__() {
          var s0;
          s0 = peg$parseendOfLineComment();
          if (s0 === peg$FAILED) {
            s0 = peg$parsewhitespace();
          }
          return s0;
        }
        function peg$parse_() {
          var s0, s1;
          s0 = [];
          s1 = peg$parse__();
          while (s1 !== peg$FAILED) {
            s0.push(s1);
            s1 = peg$parse__();
          }
          return s0;
        }
        function peg$parseform() {
          var s0, s1;
          s0 = peg$currPos;
          s1 = peg$parselist();
          if (s1 === peg$FAILED) {
            s1 = peg$parseatom();
            if (s1 === peg$FAILED) {
              s1 = peg$parsestring();
              if (s1 === peg$FAILED) {
                s1 = peg$parsequotedForm();
              }
            }
          }
          if (s1 !== peg$FAILED) {
            peg$savedPos = s0;
            s1 = peg$c19(s1);
          }
          s0 = s1;
          return s0;
        }
        function peg$parsequotedForm() {
          var s0, s1, s2;
          s0 = peg$currPos;
          s1 = peg$parsequote();
          if (s1 !== peg$FAILED) {
            s2 = peg$parseform();
            if (s2 !== peg$FAILED) {
              peg$savedPos = s0;
              s1 = peg$c20(s1, s2);
              s0 = s1;
            } else {
              peg$currPos = s0;
              s0 = peg$FAILED;
            }
          } else {
            peg$currPos = s0;
            s0 = peg$FAILED;
          }
          return s0;
        }
        function peg$parselist() {
          var s0, s1, s2, s3, s4, s5, s6, s7;
          s0 = peg$currPos;
          s1 = peg$parse_();
          if (s1 !== peg$FAILED) {
            if (input.charCodeAt(peg$currPos) === 40) {
              s2 = peg$c21;
              peg$currPos++;
            } else {
              s2 = peg$FAILED;
              if (peg$silentFails === 0) {
                peg$fail(peg$c22);
              }
            }
            if (s2 !== peg$FAILED) {
              s3 = peg$parse_();
              if (s3 !== peg$FAILED) {
                s4 = peg$parselistContents();
                if (s4 !== peg$FAILED) {
                  s5 = peg$parse_();
                  if (s5 !== peg$FAILED) {
                    if (input.charCodeAt(peg$currPos) === 41) {
                      s6 = peg$c23;
                      peg$currPos++;
                    } else {
                      s6 = peg$FAILED;
                      if (peg$silentFails === 0) {
                        peg$fail(peg$c24);
                      }
                    }
                    if (s6 !== peg$FAILED) {
                      s7 = peg$parse_();
                      if (s7 !== peg$FAILED) {
                        peg$savedPos = s0;
                        s1 = peg$c25(s4);
                        s0 = s1;
                      } else {
                        peg$currPos = s0;
                        s0 = peg$FAILED;
                      }
                    } else {
                      peg$currPos = s0;
                      s0 = peg$FAILED;
                    }
                  } else {
                    peg$currPos = s0;
                    s0 = peg$FAILED;
                  }
                } else {
                  peg$currPos = s0;
                  s0 = peg$FAILED;
                }
              } else {
                peg$currPos = s0;
                s0 = peg$FAILED;
              }
            } else {
              peg$currPos = s0;
              s0 = peg$FAILED;
            }
          } else {
            peg$currPos = s0;
            s0 = peg$FAILED;
          }
          return s0;
        }
        function peg$parselistContents() {
          var s0, s1, s2, s3, s4, s5;
          peg$silentFails++;
          s0 = peg$currPos;
          s1 = peg$parseform();
          if (s1 === peg$FAILED) {
            s1 = null;
          }
          if (s1 !== peg$FAILED) {
            s2 = [];
            s3 = peg$currPos;
            s4 = peg$parse_();
            if (s4 !== peg$FAILED) {
              s5 = peg$parseform();
              if (s5 !== peg$FAILED) {
                s4 = [s4, s5];
                s3 = s4;
              } else {
                peg$currPos = s3;
                s3 = peg$FAILED;
              }
            } else {
              peg$currPos = s3;
              s3 = peg$FAILED;
            }
            while (s3 !== peg$FAILED) {
              s2.push(s3);
              s3 = peg$currPos;
              s4 = peg$parse_();
              if (s4 !== peg$FAILED) {
                s5 = peg$parseform();
                if (s5 !== peg$FAILED) {
                  s4 = [s4, s5];
                  s3 = s4;
                } else {
                  peg$currPos = s3;
                  s3 = peg$FAILED;
                }
              } else {
                peg$currPos = s3;
                s3 = peg$FAILED;
              }
            }
            if (s2 !== peg$FAILED) {
              peg$savedPos = s0;
              s1 = peg$c27(s1, s2);
              s0 = s1;
            } else {
              peg$currPos = s0;
              s0 = peg$FAILED;
            }
          } else {
            peg$currPos = s0;
            s0 = peg$FAILED;
          }
          peg$silentFails--;
          if (s0 === peg$FAILED) {
            s1 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c26);
            }
          }
          return s0;
        }
        function peg$parsequote() {
          var s0, s1;
          s0 = peg$currPos;
          if (input.charCodeAt(peg$currPos) === 39) {
            s1 = peg$c28;
            peg$currPos++;
          } else {
            s1 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c29);
            }
          }
          if (s1 !== peg$FAILED) {
            peg$savedPos = s0;
            s1 = peg$c30();
          }
          s0 = s1;
          if (s0 === peg$FAILED) {
            s0 = peg$currPos;
            if (input.charCodeAt(peg$currPos) === 96) {
              s1 = peg$c31;
              peg$currPos++;
            } else {
              s1 = peg$FAILED;
              if (peg$silentFails === 0) {
                peg$fail(peg$c32);
              }
            }
            if (s1 !== peg$FAILED) {
              peg$savedPos = s0;
              s1 = peg$c33();
            }
            s0 = s1;
            if (s0 === peg$FAILED) {
              s0 = peg$currPos;
              if (input.substr(peg$currPos, 2) === peg$c34) {
                s1 = peg$c34;
                peg$currPos += 2;
              } else {
                s1 = peg$FAILED;
                if (peg$silentFails === 0) {
                  peg$fail(peg$c35);
                }
              }
              if (s1 !== peg$FAILED) {
                peg$savedPos = s0;
                s1 = peg$c36();
              }
              s0 = s1;
              if (s0 === peg$FAILED) {
                s0 = peg$currPos;
                if (input.charCodeAt(peg$currPos) === 44) {
                  s1 = peg$c37;
                  peg$currPos++;
                } else {
                  s1 = peg$FAILED;
                  if (peg$silentFails === 0) {
                    peg$fail(peg$c38);
                  }
                }
                if (s1 !== peg$FAILED) {
                  peg$savedPos = s0;
                  s1 = peg$c39();
                }
                s0 = s1;
              }
            }
          }
          return s0;
        }
        function peg$parsestring() {
          var s0, s1, s2, s3, s4, s5;
          s0 = peg$currPos;
          s1 = peg$parse_();
          if (s1 !== peg$FAILED) {
            s2 = peg$parsestringDelimiter();
            if (s2 !== peg$FAILED) {
              s3 = peg$parsestringContents();
              if (s3 !== peg$FAILED) {
                s4 = peg$parsestringDelimiter();
                if (s4 !== peg$FAILED) {
                  s5 = peg$parse_();
                  if (s5 !== peg$FAILED) {
                    peg$savedPos = s0;
                    s1 = peg$c40(s3);
                    s0 = s1;
                  } else {
                    peg$currPos = s0;
                    s0 = peg$FAILED;
                  }
                } else {
                  peg$currPos = s0;
                  s0 = peg$FAILED;
                }
              } else {
                peg$currPos = s0;
                s0 = peg$FAILED;
              }
            } else {
              peg$currPos = s0;
              s0 = peg$FAILED;
            }
          } else {
            peg$currPos = s0;
            s0 = peg$FAILED;
          }
          return s0;
        }
        function peg$parsestringDelimiter() {
          var s0;
          if (input.charCodeAt(peg$currPos) === 34) {
            s0 = peg$c41;
            peg$currPos++;
          } else {
            s0 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c42);
            }
          }
          return s0;
        }
        function peg$parsestringContents() {
          var s0, s1;
          s0 = [];
          s1 = peg$parsestringChar();
          if (s1 === peg$FAILED) {
            s1 = peg$parsestringEscapedChar();
            if (s1 === peg$FAILED) {
              s1 = peg$parsestringEscapedSpecialChar();
            }
          }
          while (s1 !== peg$FAILED) {
            s0.push(s1);
            s1 = peg$parsestringChar();
            if (s1 === peg$FAILED) {
              s1 = peg$parsestringEscapedChar();
              if (s1 === peg$FAILED) {
                s1 = peg$parsestringEscapedSpecialChar();
              }
            }
          }
          return s0;
        }
        function peg$parsestringEscapedChar() {
          var s0, s1, s2;
          s0 = peg$currPos;
          if (input.charCodeAt(peg$currPos) === 92) {
            s1 = peg$c43;
            peg$currPos++;
          } else {
            s1 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c44);
            }
          }
          if (s1 !== peg$FAILED) {
            s2 = peg$parsestringCharNeedingEscape();
            if (s2 !== peg$FAILED) {
              peg$savedPos = s0;
              s1 = peg$c45(s2);
              s0 = s1;
            } else {
              peg$currPos = s0;
              s0 = peg$FAILED;
            }
          } else {
            peg$currPos = s0;
            s0 = peg$FAILED;
          }
          return s0;
        }
        function peg$parsestringCharNeedingEscape() {
          var s0;
          if (peg$c46.test(input.charAt(peg$currPos))) {
            s0 = input.charAt(peg$currPos);
            peg$currPos++;
          } else {
            s0 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c47);
            }
          }
          return s0;
        }
        function peg$parsestringChar() {
          var s0;
          if (peg$c48.test(input.charAt(peg$currPos))) {
            s0 = input.charAt(peg$currPos);
            peg$currPos++;
          } else {
            s0 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c49);
            }
          }
          return s0;
        }
        function peg$parsestringEscapedSpecialCharLetter() {
          var s0;
          if (peg$c50.test(input.charAt(peg$currPos))) {
            s0 = input.charAt(peg$currPos);
            peg$currPos++;
          } else {
            s0 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c51);
            }
          }
          return s0;
        }
        function peg$parsestringEscapedSpecialChar() {
          var s0, s1, s2;
          s0 = peg$currPos;
          if (input.charCodeAt(peg$currPos) === 92) {
            s1 = peg$c43;
            peg$currPos++;
          } else {
            s1 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c44);
            }
          }
          if (s1 !== peg$FAILED) {
            s2 = peg$parsestringEscapedSpecialCharLetter();
            if (s2 !== peg$FAILED) {
              peg$savedPos = s0;
              s1 = peg$c52(s2);
              s0 = s1;
            } else {
              peg$currPos = s0;
              s0 = peg$FAILED;
            }
          } else {
            peg$currPos = s0;
            s0 = peg$FAILED;
          }
          return s0;
        }
        function peg$parseatom() {
          var s0, s1, s2, s3;
          s0 = peg$currPos;
          s1 = peg$parse_();
          if (s1 !== peg$FAILED) {
            s2 = peg$parseatomContents();
            if (s2 !== peg$FAILED) {
              s3 = peg$parse_();
              if (s3 !== peg$FAILED) {
                peg$savedPos = s0;
                s1 = peg$c53(s2);
                s0 = s1;
              } else {
                peg$currPos = s0;
                s0 = peg$FAILED;
              }
            } else {
              peg$currPos = s0;
              s0 = peg$FAILED;
            }
          } else {
            peg$currPos = s0;
            s0 = peg$FAILED;
          }
          return s0;
        }
        function peg$parseatomContents() {
          var s0, s1, s2;
          s0 = peg$currPos;
          s1 = [];
          s2 = peg$parseatomChar();
          if (s2 === peg$FAILED) {
            s2 = peg$parseatomEscapedChar();
          }
          if (s2 !== peg$FAILED) {
            while (s2 !== peg$FAILED) {
              s1.push(s2);
              s2 = peg$parseatomChar();
              if (s2 === peg$FAILED) {
                s2 = peg$parseatomEscapedChar();
              }
            }
          } else {
            s1 = peg$FAILED;
          }
          if (s1 !== peg$FAILED) {
            peg$savedPos = s0;
            s1 = peg$c54(s1);
          }
          s0 = s1;
          return s0;
        }
        function peg$parseatomEscapedChar() {
          var s0, s1, s2;
          s0 = peg$currPos;
          if (input.charCodeAt(peg$currPos) === 92) {
            s1 = peg$c43;
            peg$currPos++;
          } else {
            s1 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c44);
            }
          }
          if (s1 !== peg$FAILED) {
            s2 = peg$parseatomCharNeedingEscape();
            if (s2 !== peg$FAILED) {
              peg$savedPos = s0;
              s1 = peg$c55(s1, s2);
              s0 = s1;
            } else {
              peg$currPos = s0;
              s0 = peg$FAILED;
            }
          } else {
            peg$currPos = s0;
            s0 = peg$FAILED;
          }
          return s0;
        }
        function peg$parseatomCharNeedingEscape() {
          var s0;
          if (peg$c56.test(input.charAt(peg$currPos))) {
            s0 = input.charAt(peg$currPos);
            peg$currPos++;
          } else {
            s0 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c57);
            }
          }
          return s0;
        }
        function peg$parseatomChar() {
          var s0;
          if (peg$c58.test(input.charAt(peg$currPos))) {
            s0 = input.charAt(peg$currPos);
            peg$currPos++;
          } else {
            s0 = peg$FAILED;
            if (peg$silentFails === 0) {
              peg$fail(peg$c59);
            }
          }
          return s0;
        }
        function extractList(list2, index) {
          var result = [], i;
          for (i = 0; i < list2.length; i++) {
            if (list2[i][index] !== null) {
              result.push(list2[i][index]);
            }
          }
          return result;
        }
        function buildList(first, rest, index) {
          return (first !== null ? [first] : []).concat(extractList(rest, index));
        }
        function outputString(content, loc) {
          return {
            type: "string",
            content,
            location: loc
          };
        }
        function outputAtom(content, loc) {
          return {
            type: "atom",
            content,
            location: loc
          };
        }
        function outputList(content, loc) {
          return {
            type: "list",
            content,
            location: loc
          };
        }
        peg$result = peg$startRuleFunction();
        if (peg$result !== peg$FAILED && peg$currPos === input.length) {
          return peg$result;
        } else {
          if (peg$result !== peg$FAILED && peg$currPos < input.length) {
            peg$fail({ type: "end", description: "end of input" });
          }
          throw peg$buildException(
            null,
            peg$maxFailExpected,
            peg$maxFailPos < input.length ? input.charAt(peg$maxFailPos) : null,
            peg$maxFailPos < input.length ? peg$computeLocation(peg$maxFailPos, peg$maxFailPos + 1) : peg$computeLocation(peg$maxFailPos, peg$maxFailPos)
          );
        }
      }
      return {
        SyntaxError: peg$SyntaxError,
        parse: peg$parse
      };
    })();
  }
});

// node_modules/picocolors/picocolors.js
var require_picocolors = __commonJS({
  "node_modules/picocolors/picocolors.js"(exports, module) {
    var p = process || {};
    var argv = p.argv || [];
    var env = p.env || {};
    var isColorSupported = !(!!env.NO_COLOR || argv.includes("--no-color")) && (!!env.FORCE_COLOR || argv.includes("--color") || p.platform === "win32" || (p.stdout || {}).isTTY && env.TERM !== "dumb" || !!env.CI);
    var formatter = (open, close, replace = open) => (input) => {
      let string = "" + input, index = string.indexOf(close, open.length);
      return ~index ? open + replaceClose(string, close, replace, index) + close : open + string + close;
    };
    var replaceClose = (string, close, replace, index) => {
      let result = "", cursor = 0;
      do {
        result += string.substring(cursor, index) + replace;
        cursor = index + close.length;
        index = string.indexOf(close, cursor);
      } while (~index);
      return result + string.substring(cursor);
    };
    var createColors2 = (enabled = isColorSupported) => {
      let f = enabled ? formatter : () => String;
      return {
        isColorSupported: enabled,
        reset: f("\x1B[0m", "\x1B[0m"),
        bold: f("\x1B[1m", "\x1B[22m", "\x1B[22m\x1B[1m"),
        dim: f("\x1B[2m", "\x1B[22m", "\x1B[22m\x1B[2m"),
        italic: f("\x1B[3m", "\x1B[23m"),
        underline: f("\x1B[4m", "\x1B[24m"),
        inverse: f("\x1B[7m", "\x1B[27m"),
        hidden: f("\x1B[8m", "\x1B[28m"),
        strikethrough: f("\x1B[9m", "\x1B[29m"),
        black: f("\x1B[30m", "\x1B[39m"),
        red: f("\x1B[31m", "\x1B[39m"),
        green: f("\x1B[32m", "\x1B[39m"),
        yellow: f("\x1B[33m", "\x1B[39m"),
        blue: f("\x1B[34m", "\x1B[39m"),
        magenta: f("\x1B[35m", "\x1B[39m"),
        cyan: f("\x1B[36m", "\x1B[39m"),
        white: f("\x1B[37m", "\x1B[39m"),
        gray: f("\x1B[90m", "\x1B[39m"),
        bgBlack: f("\x1B[40m", "\x1B[49m"),
        bgRed: f("\x1B[41m", "\x1B[49m"),
        bgGreen: f("\x1B[42m", "\x1B[49m"),
        bgYellow: f("\x1B[43m", "\x1B[49m"),
        bgBlue: f("\x1B[44m", "\x1B[49m"),
        bgMagenta: f("\x1B[45m", "\x1B[49m"),
        bgCyan: f("\x1B[46m", "\x1B[49m"),
        bgWhite: f("\x1B[47m", "\x1B[49m"),
        blackBright: f("\x1B[90m", "\x1B[39m"),
        redBright: f("\x1B[91m", "\x1B[39m"),
        greenBright: f("\x1B[92m", "\x1B[39m"),
        yellowBright: f("\x1B[93m", "\x1B[39m"),
        blueBright: f("\x1B[94m", "\x1B[39m"),
        magentaBright: f("\x1B[95m", "\x1B[39m"),
        cyanBright: f("\x1B[96m", "\x1B[39m"),
        whiteBright: f("\x1B[97m", "\x1B[39m"),
        bgBlackBright: f("\x1B[100m", "\x1B[49m"),
        bgRedBright: f("\x1B[101m", "\x1B[49m"),
        bgGreenBright: f("\x1B[102m", "\x1B[49m"),
        bgYellowBright: f("\x1B[103m", "\x1B[49m"),
        bgBlueBright: f("\x1B[104m", "\x1B[49m"),
        bgMagentaBright: f("\x1B[105m", "\x1B[49m"),
        bgCyanBright: f("\x1B[106m", "\x1B[49m"),
        bgWhiteBright: f("\x1B[107m", "\x1B[49m")
      };
    };
    module.exports = createColors2();
    module.exports.createColors = createColors2;
  }
});

// node_modules/commander/esm.mjs
var import_index = __toESM(require_commander(), 1);
var {
  program,
  createCommand,
  createArgument,
  createOption,
  CommanderError,
  InvalidArgumentError,
  InvalidOptionArgumentError,
  // deprecated old name
  Command,
  Argument,
  Option,
  Help
} = import_index.default;

// src/cli/bias.ts
import { relative as relative4 } from "node:path";

// src/engine/bias.ts
function deviceBias(ref, op, channel2) {
  const at = channel2 ? { channel: channel2 } : {};
  switch (op.kind) {
    case "bjt":
      return { ref, ...at, type: op.type, region: op.region, vbe: op.vbe, vce: op.vce, ic: op.ic, power: op.power };
    case "jfet":
    case "mosfet":
      return { ref, ...at, type: op.type, region: op.region, vgs: op.vgs, vds: op.vds, id: op.id, power: op.power };
    case "diode":
      return void 0;
  }
}
function railCurrent(ctx, rail) {
  const build = ctx.solver();
  const op = ctx.operatingPoint();
  if (!build || !op) return null;
  const node = build.nodeOfNet[rail.net];
  if (node === void 0) return null;
  for (const el of build.solver.elements) {
    if (el.kind !== "V") continue;
    const delivered = op.deliveredCurrents[el.name];
    if (delivered === void 0) continue;
    if (el.pos === node && el.neg === "0") return rail.volts < 0 ? -delivered : delivered;
    if (el.neg === node && el.pos === "0") return rail.volts < 0 ? delivered : -delivered;
  }
  return null;
}
function biasReport(ctx, file) {
  const op = ctx.operatingPoint();
  const devices = [];
  if (op) {
    for (const part of ctx.devices()) {
      if (part.kind === "dual-gate-mosfet") {
        for (const channel2 of ["g1", "g2"]) {
          const d2 = ctx.device(part.ref, channel2);
          const row2 = d2 && deviceBias(part.ref, d2, channel2);
          if (row2) devices.push(row2);
        }
        continue;
      }
      const d = ctx.device(part.ref);
      const row = d && deviceBias(part.ref, d);
      if (row) devices.push(row);
    }
  }
  const problem2 = op ? op.problem : ctx.operatingPointProblem() ?? ctx.solverProblem();
  return {
    file,
    converged: op?.converged ?? false,
    ...op ? { method: op.method } : {},
    ...problem2 ? { problem: problem2 } : {},
    rails: ctx.rails().map((rail) => ({ net: rail.net, volts: rail.volts, amps: railCurrent(ctx, rail), from: rail.from })),
    devices,
    unmodelled: ctx.unmodelled().map((u) => ({ ref: u.ref, reason: u.reason }))
  };
}

// src/engine/lint.ts
import { dirname as dirname6, relative as relative3, resolve as resolve3 } from "node:path";

// src/read/file-source.ts
import { readFileSync, realpathSync, statSync } from "node:fs";
function describeFsError(err) {
  const code = typeof err === "object" && err !== null && "code" in err ? String(err.code) : "";
  switch (code) {
    case "ENOENT":
      return "no such file";
    case "EACCES":
    case "EPERM":
      return "permission denied";
    case "EISDIR":
      return "is a directory, not a file";
    case "ELOOP":
      return "too many symbolic links";
    case "ENAMETOOLONG":
      return "path too long";
    default:
      return err instanceof Error ? err.message : String(err);
  }
}
function nodeFileSource() {
  return {
    read(path) {
      try {
        return readFileSync(path);
      } catch (err) {
        return { error: describeFsError(err) };
      }
    },
    realpath(path) {
      try {
        return realpathSync(path);
      } catch (err) {
        return { error: describeFsError(err) };
      }
    },
    size(path) {
      try {
        const st = statSync(path);
        if (!st.isFile()) return { error: st.isDirectory() ? "is a directory, not a file" : "not a regular file" };
        return st.size;
      } catch (err) {
        return { error: describeFsError(err) };
      }
    }
  };
}

// src/read/index.ts
import { dirname as dirname3 } from "node:path";

// src/read/kicad-sch/escapes.ts
var ESCAPES = {
  slash: "/",
  backslash: "\\",
  colon: ":",
  lt: "<",
  gt: ">",
  dblquote: '"',
  quote: "'",
  tab: "	",
  return: "\n",
  space: " ",
  comma: ",",
  bar: "|",
  brace: "{"
};
var ESCAPE_PATTERN = /\{(slash|backslash|colon|lt|gt|dblquote|quote|tab|return|space|comma|bar|brace)\}/g;
function unescapeKicad(text) {
  return text.includes("{") ? text.replace(ESCAPE_PATTERN, (_, name) => ESCAPES[name] ?? "") : text;
}
function escapeNetText(text) {
  return text.replace(/[\r\n]/g, "").replace(/\//g, "{slash}");
}

// src/read/kicad-sch/versions.ts
var OLDEST_KNOWN_VERSION = 20200310;
var NEWEST_KNOWN_VERSION = 20260101;
var TILDE_IS_LITERAL_FROM = 20250318;
var POWER_NAME_FROM_VALUE = 20230221;
var KICAD6_RELEASE_VERSION = 20211123;
function fieldText(text, version) {
  return text === "~" && version < TILDE_IS_LITERAL_FROM ? "" : text;
}

// src/read/kicad-sch/net-names.ts
var PRIORITY = {
  pin: 1,
  sheetPin: 2,
  hierarchicalLabel: 3,
  localLabel: 4,
  powerPin: 5,
  globalLabel: 6
};
function compareDrivers(a, b, version) {
  if (a.priority !== b.priority) return b.priority - a.priority;
  if (a.depth !== b.depth) return a.depth - b.depth;
  if (a.rank !== b.rank) return b.rank - a.rank;
  if (version > KICAD6_RELEASE_VERSION) {
    const pa = a.name.includes("-Pad") ? 1 : 0;
    const pb = b.name.includes("-Pad") ? 1 : 0;
    if (pa !== pb) return pa - pb;
  }
  return a.name < b.name ? -1 : a.name > b.name ? 1 : 0;
}
function unitLetters(unit) {
  let n = Math.max(1, Math.trunc(unit));
  let s = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}
function defaultNetName(pin, noConnect, version) {
  const prefix = noConnect ? "unconnected-(" : "Net-(";
  if (version <= KICAD6_RELEASE_VERSION) return `${prefix}${pin.ref}-Pad${pin.number})`;
  if (pin.name !== "" && pin.name !== pin.number) {
    const pad2 = noConnect || pin.nameRepeats ? `-Pad${pin.number}` : "";
    return `${prefix}${pin.refWithUnit}-${pin.name}${pad2})`;
  }
  return `${prefix}${pin.ref}-Pad${pin.number})`;
}
var GROUND_NAME = /^(?:[ADPSC]?GND[A-Z0-9_]*|VSS[A-Z0-9_]*|0|EARTH|CHASSIS)$/i;
function isGroundName(name) {
  const last = name.slice(name.lastIndexOf("/") + 1);
  const bare = last.slice(last.lastIndexOf(":") + 1);
  return GROUND_NAME.test(bare);
}

// src/read/model-libraries.ts
import { isAbsolute as isAbsolute2, join as join2 } from "node:path";

// src/read/kicad-sch/hierarchy.ts
import { dirname, isAbsolute, join, relative } from "node:path";

// src/read/sexpr.ts
var import_sexpr_plus = __toESM(require_sexpr_plus(), 1);
var MAX_FILE_BYTES = 64 * 1024 * 1024;
var MAX_NESTING_DEPTH = 256;
var BOM = 65279;
function failure(file, line, column, message) {
  return { ok: false, error: { file, line, column, message } };
}
function decodeSource(data, file) {
  const bytes = typeof data === "string" ? Buffer.byteLength(data, "utf8") : data.length;
  if (bytes > MAX_FILE_BYTES) {
    return failure(file, 0, 0, `file is ${bytes} bytes; the reader accepts at most ${MAX_FILE_BYTES} bytes`);
  }
  if (typeof data === "string") return { ok: true, text: data };
  try {
    return { ok: true, text: new TextDecoder("utf-8", { fatal: true, ignoreBOM: true }).decode(data) };
  } catch {
    const bad = firstInvalidUtf8(data);
    const lineStart = bad === 0 ? 0 : data.lastIndexOf(10, bad - 1) + 1;
    let line = 1;
    for (let i = 0; i < lineStart; i++) if (data[i] === 10) line++;
    const column = data.subarray(lineStart, bad).toString("utf8").length + 1;
    const byte = data[bad] ?? 0;
    return failure(
      file,
      line,
      column,
      `invalid UTF-8: byte 0x${byte.toString(16).padStart(2, "0")} at offset ${bad} is not part of a valid character; KiCad files are UTF-8`
    );
  }
}
function firstInvalidUtf8(b) {
  let i = 0;
  while (i < b.length) {
    const c = b[i] ?? 0;
    if (c < 128) {
      i++;
      continue;
    }
    let need;
    let min;
    if (c >= 194 && c <= 223) {
      need = 1;
      min = 128;
    } else if (c >= 224 && c <= 239) {
      need = 2;
      min = 2048;
    } else if (c >= 240 && c <= 244) {
      need = 3;
      min = 65536;
    } else return i;
    let cp = c & 63 >> need;
    for (let k = 1; k <= need; k++) {
      const d = b[i + k];
      if (d === void 0 || (d & 192) !== 128) return i;
      cp = cp << 6 | d & 63;
    }
    if (cp < min || cp > 1114111 || cp >= 55296 && cp <= 57343) return i;
    i += need + 1;
  }
  return b.length;
}
function parseSexpr(data, file, opts = {}) {
  const decoded = decodeSource(data, file);
  if (!decoded.ok) return decoded;
  const text = decoded.text;
  if (opts.tokenizer === "own") return ownTree(text, file);
  const pre = scan(text, file, false);
  if (!pre.ok) return pre;
  if (pre.needsOwn) return ownTree(text, file);
  try {
    return { ok: true, nodes: import_sexpr_plus.default.parse(text), text, tokenizer: "sexpr-plus" };
  } catch (err) {
    if (err instanceof RangeError) return failure(file, 1, 1, "the file nests too deeply to parse");
    if (err instanceof import_sexpr_plus.default.SyntaxError) {
      return failure(file, err.location.start.line, err.location.start.column, `syntax error: ${err.message}`);
    }
    throw err;
  }
}
function ownTree(text, file) {
  const r = scan(text, file, true);
  if (!r.ok) return r;
  return { ok: true, nodes: r.nodes, text, tokenizer: "own" };
}
var LF = 10;
var CR = 13;
var TAB = 9;
var VT = 11;
var FF = 12;
var SPACE = 32;
var QUOTE = 34;
var BACKSLASH = 92;
var OPEN = 40;
var CLOSE = 41;
var APOS = 39;
var BACKTICK = 96;
var COMMA = 44;
var SEMI = 59;
var LS = 8232;
var PS = 8233;
function isSpace(c) {
  return c === SPACE || c === LF || c === TAB || c === CR || c === VT || c === FF;
}
function sexprPlusEscape(c) {
  return c === QUOTE || c === BACKSLASH || c === 98 || c === 102 || c === 110 || c === 114 || c === 116 || c === 118;
}
function isOctal(c) {
  return c >= 48 && c <= 55;
}
function hexValue(c) {
  if (c >= 48 && c <= 57) return c - 48;
  if (c >= 97 && c <= 102) return c - 87;
  if (c >= 65 && c <= 70) return c - 55;
  return -1;
}
function scan(text, file, build) {
  const n = text.length;
  let i = 0;
  let line = 1;
  let lineStart = 0;
  let needsOwn = false;
  if (n > 0 && text.charCodeAt(0) === BOM) {
    i = 1;
    lineStart = 1;
    needsOwn = true;
  }
  if (text.startsWith("#!", i)) needsOwn = true;
  const top = [];
  const open = [];
  const here = () => ({ offset: i, line, column: i - lineStart + 1 });
  while (i < n) {
    const c = text.charCodeAt(i);
    if (c === LF) {
      i++;
      line++;
      lineStart = i;
      continue;
    }
    if (c === SPACE || c === TAB) {
      i++;
      continue;
    }
    if (c === CR || c === VT || c === FF) {
      if (c !== CR || text.charCodeAt(i + 1) !== LF) needsOwn = true;
      i++;
      continue;
    }
    if (c === OPEN) {
      const column2 = i - lineStart + 1;
      if (open.length >= MAX_NESTING_DEPTH) {
        return failure(file, line, column2, `lists nest more than ${MAX_NESTING_DEPTH} levels deep (the reader's limit); the file is malformed`);
      }
      const list2 = build ? { type: "list", content: [], location: { start: here(), end: here() } } : null;
      open.push({ list: list2, line, column: column2, offset: i });
      i++;
      continue;
    }
    if (c === CLOSE) {
      const frame = open.pop();
      if (!frame) return failure(file, line, i - lineStart + 1, "unexpected ')': no list is open here");
      i++;
      if (build && frame.list) {
        frame.list.location.end = here();
        const parent = open[open.length - 1];
        (parent?.list ? parent.list.content : top).push(frame.list);
      }
      continue;
    }
    if (c === QUOTE) {
      const start2 = here();
      let j2 = i + 1;
      let out = "";
      let chunk = j2;
      let closed = false;
      while (j2 < n) {
        const d = text.charCodeAt(j2);
        if (d === QUOTE) {
          closed = true;
          break;
        }
        if (d === LF) {
          line++;
          lineStart = j2 + 1;
          j2++;
          continue;
        }
        if (d === CR || d === LS || d === PS) {
          if (d !== CR || text.charCodeAt(j2 + 1) !== LF) needsOwn = true;
          j2++;
          continue;
        }
        if (d === BACKSLASH) {
          const e = text.charCodeAt(j2 + 1);
          if (!sexprPlusEscape(e)) needsOwn = true;
          if (build) out += text.slice(chunk, j2);
          const consumed = build ? decodeEscape(text, j2, (s) => {
            out += s;
          }) : 2;
          if (j2 + 1 < n && text.charCodeAt(j2 + 1) === LF) {
            line++;
            lineStart = j2 + 2;
          }
          j2 += consumed;
          chunk = j2;
          continue;
        }
        j2++;
      }
      if (!closed) {
        i = n;
        const end = here();
        return failure(
          file,
          end.line,
          end.column,
          `expected '"' to close the string that starts at line ${start2.line}, column ${start2.column} (the file ends first)`
        );
      }
      if (build) out += text.slice(chunk, j2);
      i = j2 + 1;
      if (build) {
        const node = { type: "string", content: detach(out), location: { start: start2, end: here() } };
        const parent = open[open.length - 1];
        (parent?.list ? parent.list.content : top).push(node);
      }
      continue;
    }
    const start = i;
    let j = i;
    while (j < n) {
      const d = text.charCodeAt(j);
      if (isSpace(d) || d === OPEN || d === CLOSE || d === QUOTE) break;
      if (d === APOS || d === BACKTICK || d === COMMA || d === SEMI || d === BACKSLASH || d === LS || d === PS) needsOwn = true;
      j++;
    }
    const column = start - lineStart + 1;
    i = j;
    if (build) {
      const node = {
        type: "atom",
        content: detach(text.slice(start, j)),
        location: { start: { offset: start, line, column }, end: here() }
      };
      const parent = open[open.length - 1];
      (parent?.list ? parent.list.content : top).push(node);
    }
  }
  const unclosed = open[open.length - 1];
  if (unclosed) {
    const end = here();
    return failure(
      file,
      end.line,
      end.column,
      `expected ')' to close the list opened at line ${unclosed.line}, column ${unclosed.column} (the file ends first)`
    );
  }
  return { ok: true, needsOwn, nodes: top };
}
function detach(s) {
  return s.length < 13 ? s : (" " + s).slice(1);
}
function decodeEscape(text, j, emit) {
  const e = text.charCodeAt(j + 1);
  switch (e) {
    case QUOTE:
      emit('"');
      return 2;
    case BACKSLASH:
      emit("\\");
      return 2;
    case 110:
      emit("\n");
      return 2;
    // n
    case 114:
      emit("\r");
      return 2;
    // r
    case 116:
      emit("	");
      return 2;
    // t
    case 97:
      emit("\x07");
      return 2;
    // a
    case 98:
      emit("\b");
      return 2;
    // b
    case 102:
      emit("\f");
      return 2;
    // f
    case 118:
      emit("\v");
      return 2;
    // v
    case 120: {
      const h1 = hexValue(text.charCodeAt(j + 2));
      if (h1 < 0) {
        emit("\\x");
        return 2;
      }
      const h2 = hexValue(text.charCodeAt(j + 3));
      if (h2 < 0) {
        emit(String.fromCharCode(h1));
        return 3;
      }
      emit(String.fromCharCode(h1 * 16 + h2));
      return 4;
    }
    default:
      if (isOctal(e)) {
        let k = 1;
        let v = 0;
        while (k <= 3 && isOctal(text.charCodeAt(j + k))) {
          v = v * 8 + (text.charCodeAt(j + k) - 48);
          k++;
        }
        emit(String.fromCharCode(v));
        return k;
      }
      if (Number.isNaN(e)) {
        emit("\\");
        return 1;
      }
      emit("\\" + text.charAt(j + 1));
      return 2;
  }
}
function isList(n) {
  return n !== void 0 && n.type === "list";
}
function textOf(n) {
  return n !== void 0 && n.type !== "list" ? n.content : void 0;
}
function keywordOf(n) {
  if (!isList(n)) return void 0;
  const first = n.content[0];
  return first !== void 0 && first.type === "atom" ? first.content : void 0;
}
function childrenOf(list2, keyword) {
  const out = [];
  for (const c of list2.content) if (keywordOf(c) === keyword) out.push(c);
  return out;
}
function childOf(list2, keyword) {
  for (const c of list2.content) if (keywordOf(c) === keyword) return c;
  return void 0;
}
function argAt(list2, index) {
  return list2?.content[index];
}
function argText(list2, index) {
  return textOf(argAt(list2, index));
}
var NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
function argNumber(list2, index) {
  const t = argText(list2, index);
  return t !== void 0 && NUMBER.test(t) ? Number(t) : void 0;
}
var TRUE_WORDS = /* @__PURE__ */ new Set(["yes", "true", "1"]);
var FALSE_WORDS = /* @__PURE__ */ new Set(["no", "false", "0"]);
function flagOf(list2, keyword) {
  for (let k = 1; k < list2.content.length; k++) {
    const c = list2.content[k];
    if (c === void 0) continue;
    if (c.type === "atom" && c.content === keyword) return true;
    if (keywordOf(c) === keyword) {
      const v = argText(c, 1);
      if (v === void 0) return true;
      if (TRUE_WORDS.has(v.toLowerCase())) return true;
      if (FALSE_WORDS.has(v.toLowerCase())) return false;
      return void 0;
    }
  }
  return void 0;
}
function tokenEnd(n, text) {
  let e = n.location.end.offset;
  const floor = n.location.start.offset + 1;
  while (e > floor) {
    const c = text.charCodeAt(e - 1);
    if (c !== SPACE && c !== LF && c !== TAB && c !== CR) break;
    e--;
  }
  return e;
}
function where(n) {
  const s = n.location.start;
  return { line: s.line, column: s.column, offset: s.offset };
}

// src/read/load-file.ts
function wholeFileError(file, message) {
  return { ok: false, error: { file, line: 0, column: 0, message } };
}
function loadTree(fs, file, opts = {}) {
  const real = fs.realpath(file);
  if (typeof real !== "string") return wholeFileError(file, `cannot open: ${real.error}`);
  const size = fs.size?.(real);
  if (size !== void 0) {
    if (typeof size !== "number") return wholeFileError(file, `cannot open: ${size.error}`);
    if (size > MAX_FILE_BYTES) {
      return wholeFileError(file, `file is ${size} bytes; the reader accepts at most ${MAX_FILE_BYTES} bytes`);
    }
  }
  const data = fs.read(real);
  if (!Buffer.isBuffer(data)) return wholeFileError(file, `cannot read: ${data.error}`);
  try {
    const tree = parseSexpr(data, file, opts);
    return tree.ok ? { ok: true, tree, real } : tree;
  } catch (err) {
    if (err instanceof RangeError) return wholeFileError(file, "the file is too deeply nested or too large to parse");
    throw err;
  }
}

// src/read/kicad-sch/geometry.ts
var GRID_UNITS_PER_MM = 1e4;
var MAX_COORDINATE = 2 ** 25 - 1;
function toGrid(mm) {
  const scaled = mm * GRID_UNITS_PER_MM;
  return scaled < 0 ? -Math.round(-scaled) : Math.round(scaled);
}
function inRange(v) {
  return Number.isFinite(v) && Math.abs(v) <= MAX_COORDINATE;
}
function pointKey(x, y) {
  return x * 67108864 + y;
}
function pinOffset(px, py, angle, mirror) {
  const u = px;
  const v = -py;
  let x;
  let y;
  switch (angle) {
    case 90:
      x = v;
      y = -u;
      break;
    case 180:
      x = -u;
      y = -v;
      break;
    case 270:
      x = -v;
      y = u;
      break;
    default:
      x = u;
      y = v;
      break;
  }
  if (mirror === "x") y = -y;
  else if (mirror === "y") x = -x;
  return [x + 0, y + 0];
}
function quarterTurn(angle) {
  const norm = (angle % 360 + 360) % 360;
  const snapped = Math.round(norm / 90) * 90 % 360;
  return { angle: snapped, exact: Math.abs(norm - snapped) < 1e-9 };
}

// src/read/kicad-sch/lib-symbols.ts
var SUB_SYMBOL_SUFFIX = /_(\d+)_(\d+)$/;
function extractLibSymbols(section, version, file, notes) {
  const lib = /* @__PURE__ */ new Map();
  for (const sym of childrenOf(section, "symbol")) {
    const rawId = argText(sym, 1);
    if (rawId === void 0) {
      const p = where(sym);
      notes.push({ file, line: p.line, column: p.column, message: "library symbol without a name; ignored" });
      continue;
    }
    lib.set(unescapeKicad(rawId), readLibSymbol(sym, unescapeKicad(rawId), version, file, notes));
  }
  resolveDerived(lib, file, notes);
  return lib;
}
function readLibSymbol(sym, id, version, file, notes) {
  const powerList = childOf(sym, "power");
  const power = powerList ? argText(powerList, 1) === "local" ? "local" : "global" : void 0;
  const properties = {};
  for (const prop of childrenOf(sym, "property")) {
    const name = argText(prop, 1);
    const value = argText(prop, 2);
    if (name !== void 0 && value !== void 0) properties[name] = fieldText(value, version);
  }
  const pins = [];
  let unitCount = 1;
  for (const pin of childrenOf(sym, "pin")) {
    const p = readPin(pin, 0, 0, version, file, notes);
    if (p) pins.push(p);
  }
  for (const sub of childrenOf(sym, "symbol")) {
    const m = SUB_SYMBOL_SUFFIX.exec(argText(sub, 1) ?? "");
    const unit = m ? Number(m[1]) : 0;
    const style = m ? Number(m[2]) : 0;
    if (!m) {
      const p = where(sub);
      notes.push({
        file,
        line: p.line,
        column: p.column,
        message: `sub-symbol "${argText(sub, 1) ?? ""}" of ${id} does not end in _UNIT_STYLE; its pins are treated as common to all units`
      });
    }
    unitCount = Math.max(unitCount, unit);
    for (const pin of childrenOf(sub, "pin")) {
      const p = readPin(pin, unit, style, version, file, notes);
      if (p) pins.push(p);
    }
  }
  const extendsName = argText(childOf(sym, "extends"), 1);
  const out = { id, power, pins, unitCount, properties };
  if (extendsName !== void 0) out.extendsName = extendsName;
  return out;
}
function readPin(pin, unit, style, version, file, notes) {
  const at = childOf(pin, "at");
  const px = argNumber(at, 1);
  const py = argNumber(at, 2);
  if (px === void 0 || py === void 0 || !inRange(toGrid(px)) || !inRange(toGrid(py))) {
    const p = where(pin);
    notes.push({ file, line: p.line, column: p.column, message: "library pin without a readable (at x y) position; ignored" });
    return void 0;
  }
  const rawType = argText(pin, 1) ?? "unspecified";
  const alternates = /* @__PURE__ */ new Map();
  for (const alt of childrenOf(pin, "alternate")) {
    const name = argText(alt, 1);
    if (name !== void 0) alternates.set(name, normaliseType(argText(alt, 2) ?? rawType));
  }
  return {
    number: fieldText(argText(childOf(pin, "number"), 1) ?? "", version),
    name: fieldText(argText(childOf(pin, "name"), 1) ?? "", version),
    type: normaliseType(keywordOf(pin) === "pin" ? rawType : "unspecified"),
    x: toGrid(px),
    y: toGrid(py),
    unit,
    style,
    hidden: flagOf(pin, "hide") === true,
    alternates
  };
}
function normaliseType(t) {
  return t === "unconnected" ? "no_connect" : t;
}
function resolveDerived(lib, file, notes) {
  const resolving = /* @__PURE__ */ new Set();
  const resolve8 = (sym) => {
    if (sym.extendsName === void 0) return;
    if (resolving.has(sym.id)) {
      notes.push({ file, line: 0, column: 0, message: `library symbol ${sym.id} extends itself through its parents; inheritance ignored` });
      delete sym.extendsName;
      return;
    }
    const prefix = sym.id.includes(":") ? sym.id.slice(0, sym.id.indexOf(":") + 1) : "";
    const parent = lib.get(prefix + sym.extendsName) ?? lib.get(sym.extendsName);
    if (!parent) {
      notes.push({ file, line: 0, column: 0, message: `library symbol ${sym.id} extends "${sym.extendsName}", which is not embedded; it keeps only its own pins` });
      delete sym.extendsName;
      return;
    }
    resolving.add(sym.id);
    resolve8(parent);
    resolving.delete(sym.id);
    if (sym.pins.length === 0) {
      sym.pins = parent.pins;
      sym.unitCount = parent.unitCount;
    }
    sym.power ??= parent.power;
    sym.properties = { ...parent.properties, ...sym.properties };
    delete sym.extendsName;
  };
  for (const sym of lib.values()) resolve8(sym);
}

// src/read/kicad-sch/properties.ts
function readProperty(prop) {
  let i = 1;
  const first = prop.content[1];
  if (first?.type === "atom" && first.content === "private") i = 2;
  const nameNode = prop.content[i];
  const valueNode = prop.content[i + 1];
  const name = textOf(nameNode);
  const value = textOf(valueNode);
  if (name === void 0 || value === void 0 || valueNode === void 0) return void 0;
  return { name, value, valueNode };
}

// src/read/kicad-sch/placed-symbols.ts
function readPlacedSymbol(sym, version, file, text, notes) {
  const pos = where(sym);
  const note = (message) => {
    notes.push({ file, line: pos.line, column: pos.column, message });
  };
  const rawLibId = argText(childOf(sym, "lib_id"), 1);
  if (rawLibId === void 0) {
    note("placed symbol without (lib_id \u2026); ignored");
    return void 0;
  }
  const libId = unescapeKicad(rawLibId);
  const libName = argText(childOf(sym, "lib_name"), 1);
  const at = childOf(sym, "at");
  const xmm = argNumber(at, 1);
  const ymm = argNumber(at, 2);
  if (xmm === void 0 || ymm === void 0 || !inRange(toGrid(xmm)) || !inRange(toGrid(ymm))) {
    note(`placed symbol ${libId} without a readable (at x y) position; ignored`);
    return void 0;
  }
  const turn = quarterTurn(argNumber(at, 3) ?? 0);
  if (!turn.exact) note(`symbol rotation ${argNumber(at, 3) ?? 0}\xB0 is not a multiple of 90\xB0; read as ${turn.angle}\xB0`);
  const mirrorText = argText(childOf(sym, "mirror"), 1);
  const mirror = mirrorText === "x" || mirrorText === "y" ? mirrorText : void 0;
  let reference = "";
  let value = "";
  let valueSpan;
  let footprint = "";
  const fields = {};
  for (const propList of childrenOf(sym, "property")) {
    const prop = readProperty(propList);
    if (!prop) continue;
    const shown3 = fieldText(prop.value, version);
    switch (prop.name.toLowerCase()) {
      case "reference":
        reference = shown3;
        break;
      case "value":
        value = shown3;
        valueSpan = { start: prop.valueNode.location.start.offset, end: tokenEnd(prop.valueNode, text) };
        break;
      case "footprint":
        footprint = shown3;
        break;
      // A repeated user field overwrites the earlier one, as the editor does on load.
      default:
        fields[prop.name] = shown3;
    }
  }
  const alternates = /* @__PURE__ */ new Map();
  for (const pin of childrenOf(sym, "pin")) {
    const number = argText(pin, 1);
    const alt = argText(childOf(pin, "alternate"), 1);
    if (number !== void 0 && alt !== void 0) alternates.set(number, alt);
  }
  const instances = /* @__PURE__ */ new Map();
  for (const inst of childrenOf(sym, "instances")) {
    for (const project of childrenOf(inst, "project")) {
      for (const path of childrenOf(project, "path")) {
        const p = argText(path, 1);
        if (p !== void 0) instances.set(p.toLowerCase(), readInstanceData(path, version, text));
      }
    }
  }
  const defaultList = childOf(sym, "default_instance");
  const out = {
    libKey: libName !== void 0 ? unescapeKicad(libName) : libId,
    libId,
    x: toGrid(xmm),
    y: toGrid(ymm),
    angle: turn.angle,
    mirror,
    unit: Math.max(1, Math.trunc(argNumber(childOf(sym, "unit"), 1) ?? 1)),
    bodyStyle: Math.max(1, Math.trunc(argNumber(childOf(sym, "body_style") ?? childOf(sym, "convert"), 1) ?? 1)),
    uuid: (argText(childOf(sym, "uuid"), 1) ?? "").toLowerCase(),
    reference,
    value,
    footprint,
    fields,
    inBom: flagOf(sym, "in_bom") !== false,
    onBoard: flagOf(sym, "on_board") !== false,
    dnp: flagOf(sym, "dnp") === true || dnpField(fields),
    excludeFromSim: flagOf(sym, "exclude_from_sim") === true || simDisabledByField(fields),
    alternates,
    instances,
    line: pos.line,
    column: pos.column
  };
  if (valueSpan) out.valueSpan = valueSpan;
  if (defaultList) out.defaultInstance = readInstanceData(defaultList, version, text);
  return out;
}
function readInstanceData(list2, version, text) {
  const data = {};
  const reference = argText(childOf(list2, "reference"), 1);
  if (reference !== void 0) data.reference = reference;
  const unit = argNumber(childOf(list2, "unit"), 1);
  if (unit !== void 0 && unit >= 1) data.unit = Math.trunc(unit);
  const valueList = childOf(list2, "value");
  const valueNode = valueList?.content[1];
  if (valueNode !== void 0 && valueNode.type !== "list") {
    data.value = fieldText(valueNode.content, version);
    data.valueSpan = { start: valueNode.location.start.offset, end: tokenEnd(valueNode, text) };
  }
  const footprint = argText(childOf(list2, "footprint"), 1);
  if (footprint !== void 0) data.footprint = fieldText(footprint, version);
  return data;
}
var FALSE_TEXT = /* @__PURE__ */ new Set(["", "0", "n", "no", "false", "off"]);
function dnpField(fields) {
  for (const [name, value] of Object.entries(fields)) {
    const n = name.toLowerCase();
    if ((n === "dnp" || n === "dnf") && !FALSE_TEXT.has(value.trim().toLowerCase())) return true;
  }
  return false;
}
function simDisabledByField(fields) {
  for (const [name, value] of Object.entries(fields)) {
    const n = name.toLowerCase();
    if ((n === "sim.enable" || n === "spice_netlist_enabled") && FALSE_TEXT.has(value.trim().toLowerCase()) && value.trim() !== "") {
      return true;
    }
  }
  return false;
}

// src/read/kicad-sch/sheet-items.ts
function noteAt(file, notes) {
  return (list2, message) => {
    const p = where(list2);
    notes.push({ file, line: p.line, column: p.column, message });
  };
}
function readAt(list2) {
  const at = childOf(list2, "at");
  const x = argNumber(at, 1);
  const y = argNumber(at, 2);
  if (x === void 0 || y === void 0) return void 0;
  const gx = toGrid(x);
  const gy = toGrid(y);
  if (!inRange(gx) || !inRange(gy)) return void 0;
  return { x: gx, y: gy, angle: argNumber(at, 3) ?? 0 };
}
function readSegments(item, out, note) {
  const pts = childOf(item, "pts");
  const xy = pts ? childrenOf(pts, "xy") : [];
  const coords = [];
  for (const p of xy) {
    const x = argNumber(p, 1);
    const y = argNumber(p, 2);
    if (x === void 0 || y === void 0 || !inRange(toGrid(x)) || !inRange(toGrid(y))) {
      note(item, `${keywordOf(item) ?? "wire"} with an unreadable point; ignored`);
      return;
    }
    coords.push(toGrid(x), toGrid(y));
  }
  if (coords.length < 4) {
    note(item, `${keywordOf(item) ?? "wire"} with fewer than two points; ignored`);
    return;
  }
  for (let i = 0; i + 3 < coords.length; i += 2) {
    out.push(coords[i] ?? 0, coords[i + 1] ?? 0, coords[i + 2] ?? 0, coords[i + 3] ?? 0);
  }
}
function readBusEntry(item, out, note) {
  const at = readAt(item);
  const size = childOf(item, "size");
  const dx = argNumber(size, 1);
  const dy = argNumber(size, 2);
  if (!at || dx === void 0 || dy === void 0) {
    note(item, "bus_entry without (at \u2026) and (size \u2026); ignored");
    return;
  }
  out.push(at.x, at.y, at.x + toGrid(dx), at.y + toGrid(dy));
}
function readPoint(item, out, note) {
  const at = readAt(item);
  if (!at) {
    note(item, `${keywordOf(item) ?? "item"} without a readable (at x y); ignored`);
    return;
  }
  out.push(at.x, at.y);
}
var LABEL_KINDS = {
  label: "local",
  global_label: "global",
  hierarchical_label: "hierarchical"
};
function readLabel(item, note) {
  const kind = LABEL_KINDS[keywordOf(item) ?? ""];
  const text = argText(item, 1);
  const at = readAt(item);
  if (kind === void 0 || text === void 0 || !at) {
    note(item, `${keywordOf(item) ?? "label"} without text or position; ignored`);
    return void 0;
  }
  const p = where(item);
  return { kind, text: unescapeKicad(text), x: at.x, y: at.y, shape: argText(childOf(item, "shape"), 1) ?? "", line: p.line, column: p.column };
}
function readSheet(item, note) {
  let name;
  let fileName;
  const props = childrenOf(item, "property").map(readProperty);
  for (const prop of props) {
    if (!prop) continue;
    const key = prop.name.toLowerCase().replace(/\s+/g, "");
    if (key === "sheetname") name = prop.value;
    else if (key === "sheetfile") fileName = prop.value;
  }
  name ??= props[0]?.value;
  fileName ??= props[1]?.value;
  if (fileName === void 0 || fileName === "") {
    note(item, "sheet without a Sheetfile property; ignored");
    return void 0;
  }
  const pins = [];
  for (const pin of childrenOf(item, "pin")) {
    const pinName = argText(pin, 1);
    const at = readAt(pin);
    if (pinName === void 0 || !at) {
      note(pin, "sheet pin without name or position; ignored");
      continue;
    }
    const p2 = where(pin);
    pins.push({ name: unescapeKicad(pinName), shape: argText(pin, 2) ?? "", x: at.x, y: at.y, line: p2.line, column: p2.column });
  }
  const p = where(item);
  return {
    name: name ?? "",
    fileName,
    uuid: (argText(childOf(item, "uuid"), 1) ?? "").toLowerCase(),
    pins,
    dnp: flagOf(item, "dnp") === true,
    excludeFromSim: flagOf(item, "exclude_from_sim") === true,
    onBoard: flagOf(item, "on_board") !== false,
    line: p.line,
    column: p.column
  };
}
function readSymbolInstances(item, version, text, out) {
  for (const path of childrenOf(item, "path")) {
    const p = argText(path, 1);
    if (p !== void 0) out.set(p.toLowerCase(), readInstanceData(path, version, text));
  }
}
function readBusAlias(item, out) {
  const name = argText(item, 1);
  const members = childOf(item, "members");
  if (name === void 0 || !members) return;
  const list2 = [];
  for (let i = 1; i < members.content.length; i++) {
    const t = argText(members, i);
    if (t !== void 0) list2.push(t);
  }
  out.set(name, list2);
}

// src/read/kicad-sch/extract-sheet.ts
function describeFirstForm(nodes) {
  const first = nodes[0];
  if (first === void 0) return "an empty file";
  const kw = keywordOf(first);
  if (kw !== void 0) return `"(${kw}"`;
  const t = textOf(first);
  return t !== void 0 ? `"${t.slice(0, 40)}"` : "a list without a keyword";
}
function extractSheet(nodes, text, file) {
  const root = nodes[0];
  if (root === void 0 || keywordOf(root) !== "kicad_sch" || root.type !== "list") {
    const p = root ? where(root) : { line: 1, column: 1 };
    const hint = keywordOf(root) === "export" ? " (this is a KiCad netlist; give it a .net name)" : keywordOf(root) === void 0 && textOf(root)?.startsWith("EESchema") ? " (KiCad 5 .sch files are not read; open and save the design in KiCad 6 or later)" : "";
    return { ok: false, error: {
      file,
      line: p.line,
      column: p.column,
      message: `not a KiCad schematic: expected "(kicad_sch" at the start, found ${describeFirstForm(nodes)}${hint}`
    } };
  }
  const notes = [];
  const note = noteAt(file, notes);
  const extra = nodes[1];
  if (extra !== void 0) {
    const p = where(extra);
    notes.push({ file, line: p.line, column: p.column, message: "text after the end of the schematic list; ignored" });
  }
  const versionList = childOf(root, "version");
  let version = argNumber(versionList, 1);
  if (version === void 0) {
    note(root, `no readable (version \u2026) in the schematic header; read as version ${NEWEST_KNOWN_VERSION}`);
    version = NEWEST_KNOWN_VERSION;
  } else if (version > NEWEST_KNOWN_VERSION) {
    note(versionList ?? root, `file version ${version} is newer than this reader knows (${NEWEST_KNOWN_VERSION}); reading it anyway \u2014 check the results`);
  } else if (version < OLDEST_KNOWN_VERSION) {
    note(versionList ?? root, `file version ${version} is older than the KiCad 6 schematic format this reader knows (${OLDEST_KNOWN_VERSION}); reading it anyway`);
  }
  const sheet = {
    file,
    version,
    uuid: (argText(childOf(root, "uuid"), 1) ?? "").toLowerCase(),
    lib: /* @__PURE__ */ new Map(),
    symbols: [],
    wires: [],
    buses: [],
    busEntries: [],
    junctions: [],
    noConnects: [],
    labels: [],
    sheets: [],
    symbolInstances: /* @__PURE__ */ new Map(),
    busAliases: /* @__PURE__ */ new Map(),
    notes
  };
  for (let i = 1; i < root.content.length; i++) {
    const item = root.content[i];
    if (item === void 0 || item.type !== "list") continue;
    switch (keywordOf(item)) {
      case "lib_symbols":
        sheet.lib = extractLibSymbols(item, version, file, notes);
        break;
      case "symbol": {
        const s = readPlacedSymbol(item, version, file, text, notes);
        if (s) sheet.symbols.push(s);
        break;
      }
      case "wire":
        readSegments(item, sheet.wires, note);
        break;
      case "bus":
        readSegments(item, sheet.buses, note);
        break;
      case "bus_entry":
        readBusEntry(item, sheet.busEntries, note);
        break;
      case "junction":
        readPoint(item, sheet.junctions, note);
        break;
      case "no_connect":
        readPoint(item, sheet.noConnects, note);
        break;
      case "label":
      case "global_label":
      case "hierarchical_label": {
        const l = readLabel(item, note);
        if (l) sheet.labels.push(l);
        break;
      }
      case "sheet": {
        const s = readSheet(item, note);
        if (s) sheet.sheets.push(s);
        break;
      }
      case "symbol_instances":
        readSymbolInstances(item, version, text, sheet.symbolInstances);
        break;
      case "bus_alias":
        readBusAlias(item, sheet.busAliases);
        break;
      default:
        break;
    }
  }
  return { ok: true, sheet };
}

// src/read/kicad-sch/sheet-cache.ts
var caches = /* @__PURE__ */ new WeakMap();
function cacheFor(fs) {
  let c = caches.get(fs);
  if (!c) {
    c = /* @__PURE__ */ new Map();
    caches.set(fs, c);
  }
  return c;
}
function loadSheet(fs, file) {
  const real = fs.realpath(file);
  const cache2 = cacheFor(fs);
  if (typeof real === "string") {
    const hit = cache2.get(real);
    if (hit) return hit;
  }
  const loaded = loadTree(fs, file);
  const result = loaded.ok ? fromTree(loaded.tree, file, loaded.real) : loaded;
  if (typeof real === "string") cache2.set(real, result);
  return result;
}
function sheetFromTree(fs, tree, file, real) {
  const cache2 = cacheFor(fs);
  const hit = cache2.get(real);
  if (hit) return hit;
  const result = fromTree(tree, file, real);
  cache2.set(real, result);
  return result;
}
function fromTree(tree, file, real) {
  const extracted = extractSheet(tree.nodes, tree.text, file);
  return extracted.ok ? { ok: true, sheet: extracted.sheet, real } : extracted;
}

// src/read/kicad-sch/hierarchy.ts
var MAX_SHEET_DEPTH = 32;
var MAX_SHEET_INSTANCES = 1e4;
var MAX_DESIGN_ITEMS = 5e6;
function itemCount(s) {
  return s.symbols.length + s.labels.length + (s.wires.length >> 2) + (s.buses.length >> 2) + s.sheets.length;
}
function sheetPathFor(containingFile, fileName) {
  const normal = fileName.replace(/\\/g, "/");
  return isAbsolute(normal) ? normal : join(dirname(containingFile), normal);
}
function isInside(root, real) {
  const rel = relative(root, real);
  return rel === "" || !rel.startsWith("..") && !isAbsolute(rel);
}
function buildHierarchy(fs, root, rootReal, projectRootReal) {
  const instances = [{
    index: 0,
    sheet: root,
    namePath: "/",
    uuidPath: [],
    depth: 0,
    parent: -1,
    sheetIndex: -1,
    children: [],
    dnp: false,
    excludeFromSim: false,
    onBoard: true
  }];
  const openFiles = [rootReal];
  let items = itemCount(root);
  const expand = (instIndex) => {
    const inst = instances[instIndex];
    if (!inst) return void 0;
    for (let si3 = 0; si3 < inst.sheet.sheets.length; si3++) {
      const ref = inst.sheet.sheets[si3];
      const at = (message) => ({ file: inst.sheet.file, line: ref.line, column: ref.column, message });
      const label = `sheet "${ref.name}"`;
      if (inst.depth + 1 > MAX_SHEET_DEPTH) return at(`${label}: sheets nest more than ${MAX_SHEET_DEPTH} levels deep (the reader's limit)`);
      if (instances.length >= MAX_SHEET_INSTANCES) {
        return at(`${label}: the hierarchy expands to more than ${MAX_SHEET_INSTANCES} sheet instances (the reader's limit)`);
      }
      const path = sheetPathFor(inst.sheet.file, ref.fileName);
      const real = fs.realpath(path);
      if (typeof real !== "string") return at(`${label}: cannot open its file "${ref.fileName}" (${path}): ${real.error}`);
      if (!isInside(projectRootReal, real)) {
        return at(`${label}: its file "${ref.fileName}" lies outside the project folder; refused (sheets must come from inside the project)`);
      }
      const cycleAt = openFiles.indexOf(real);
      if (cycleAt >= 0) {
        const chain = [...openFiles.slice(cycleAt), real].map((p) => relative(projectRootReal, p) || p).join(" \u2192 ");
        return at(`${label}: its file "${ref.fileName}" already contains this sheet (${chain}); a sheet cannot include itself`);
      }
      const loaded = loadSheet(fs, path);
      if (!loaded.ok) return loaded.error;
      items += itemCount(loaded.sheet);
      if (items > MAX_DESIGN_ITEMS) {
        return at(`${label}: the hierarchy expands to more than ${MAX_DESIGN_ITEMS} symbols, labels and wires over its sheet instances (the reader's limit)`);
      }
      const child = {
        index: instances.length,
        sheet: loaded.sheet,
        namePath: `${inst.namePath}${ref.name}/`,
        uuidPath: [...inst.uuidPath, ref.uuid],
        depth: inst.depth + 1,
        parent: instIndex,
        sheetIndex: si3,
        children: [],
        dnp: inst.dnp || ref.dnp,
        excludeFromSim: inst.excludeFromSim || ref.excludeFromSim,
        onBoard: inst.onBoard && ref.onBoard
      };
      instances.push(child);
      inst.children[si3] = child.index;
      openFiles.push(real);
      const err2 = expand(child.index);
      openFiles.pop();
      if (err2) return err2;
    }
    return void 0;
  };
  const err = expand(0);
  return err ? { ok: false, error: err } : { ok: true, instances };
}

// src/read/model-libraries.ts
var LIBRARY_FIELDS = ["Sim.Library", "Spice_Lib_File"];
function loadModelLibraries(parts, fs, projectRoot, notes) {
  const out = [];
  const done = /* @__PURE__ */ new Set();
  const rootReal = fs.realpath(projectRoot);
  for (const part of parts) {
    for (const field3 of LIBRARY_FIELDS) {
      const written = part.fields[field3]?.trim();
      if (!written || done.has(written)) continue;
      done.add(written);
      const note = (message) => {
        notes.push({ file: part.origin.file, line: part.origin.line, column: part.origin.column, ref: part.ref, message });
      };
      if (typeof rootReal !== "string") {
        note(`model library "${written}" not read: the project folder cannot be opened (${rootReal.error})`);
        continue;
      }
      const expanded = written.replace(/\$\{KIPRJMOD\}|\$\(KIPRJMOD\)/g, projectRoot).replace(/\\/g, "/");
      if (/\$\{|\$\(/.test(expanded)) {
        note(`model library "${written}" not read: path variables other than KIPRJMOD are not resolved`);
        continue;
      }
      const path = isAbsolute2(expanded) ? expanded : join2(projectRoot, expanded);
      const real = fs.realpath(path);
      if (typeof real !== "string") {
        note(`model library "${written}" not read: ${real.error}`);
        continue;
      }
      if (!isInside(rootReal, real)) {
        note(`model library "${written}" lies outside the project folder; not read`);
        continue;
      }
      const size = fs.size?.(real);
      if (typeof size === "object") {
        note(`model library "${written}" not read: ${size.error}`);
        continue;
      }
      if (size !== void 0 && size > MAX_FILE_BYTES) {
        note(`model library "${written}" is ${size} bytes, over the ${MAX_FILE_BYTES}-byte limit; not read`);
        continue;
      }
      const data = fs.read(real);
      if (!Buffer.isBuffer(data)) {
        note(`model library "${written}" not read: ${data.error}`);
        continue;
      }
      if (data.length > MAX_FILE_BYTES) {
        note(`model library "${written}" is over the ${MAX_FILE_BYTES}-byte limit; not read`);
        continue;
      }
      out.push({ path: written, text: data.toString("utf8") });
    }
  }
  return out;
}

// src/circuit/part-names.ts
var TO92_EBC = { pinOrder: ["E", "B", "C"], pinOrderSource: "TO-92 E-B-C, from memory of the datasheets [MEM]" };
var TO92_CBE = { pinOrder: ["C", "B", "E"], pinOrderSource: "TO-92 C-B-E (European types), from memory of the datasheets [MEM]" };
var SOT23_BJT = { pinOrder: ["B", "E", "C"], pinOrderSource: "SOT-23 B-E-C, from memory of the datasheets [MEM]" };
var TO92_DSG = { pinOrder: ["D", "S", "G"], pinOrderSource: "TO-92 D-S-G, from memory of the datasheets [MEM]" };
var KNOWN_PART_NAMES = [
  // Dual-gate (tetrode) depletion MOSFETs, BF998 class; SOT-143 pin order S-D-G2-G1 [MEM].
  { pattern: /^BF99[0-8]/, kind: "dual-gate-mosfet", pinOrder: ["S", "D", "G2", "G1"], pinOrderSource: "SOT-143 S-D-G2-G1, from memory of the BF998 datasheet [MEM]" },
  { pattern: /^(BF9(0[4-9]|6\d|8\d)|BF1\d{3}|3SK\d+)/, kind: "dual-gate-mosfet" },
  // Bipolar, NPN.
  { pattern: /^(2N3904|PN3904|MPS3904)/, kind: "npn", ...TO92_EBC },
  { pattern: /^(2N2222A?|PN2222A?|P2N2222A?|MPS2222A?)/, kind: "npn", ...TO92_EBC },
  { pattern: /^(2N4401|2N4124|2N5088|2N5089|2N4123)/, kind: "npn", ...TO92_EBC },
  { pattern: /^(MMBT3904|MMBT2222A?|MMBT4401|MMBT5089)/, kind: "npn", ...SOT23_BJT },
  { pattern: /^(BC54[6-9]|BC550|BC337|BC338|BC23[7-9]|BC10[7-9]|BC182|BC184)/, kind: "npn", ...TO92_CBE },
  { pattern: /^(BC81[78]|BC84[6-9]|BC850|BFR9[23]|BFR106|BFS17|BF199|BF240|BF494|BF959|2N918|2N5179|2N5770|MPSH10|MPSH11|2SC\d+|BFY90)/, kind: "npn" },
  // Bipolar, PNP.
  { pattern: /^(2N3906|PN3906|MPS3906|2N2907A?|PN2907A?|2N4403|2N4126|2N5087|2N4125)/, kind: "pnp", ...TO92_EBC },
  { pattern: /^(MMBT3906|MMBT2907A?|MMBT4403)/, kind: "pnp", ...SOT23_BJT },
  { pattern: /^(BC55[6-9]|BC560|BC327|BC328|BC30[7-9]|BC17[7-9]|BC212|BC214)/, kind: "pnp", ...TO92_CBE },
  { pattern: /^(BC80[78]|BC85[6-9]|BC860|MPSH81|2SA\d+|BF450)/, kind: "pnp" },
  // JFETs.
  { pattern: /^(2N548[4-6]|2N545[7-9]|MPF102)/, kind: "njfet", ...TO92_DSG },
  { pattern: /^(J30[89]|J310|J11[1-3]|2N3819|2N4416A?|BF24[45]|BF256|2SK\d+|MMBFJ3\d\d|MMBF4416|MMBF5484|U310)/, kind: "njfet" },
  { pattern: /^(J17[4-7]|J27[01]|2N546[0-2]|MMBFJ17[5-7]|2SJ\d+)/, kind: "pjfet" },
  // Enhancement MOSFETs.
  { pattern: /^2N7000/, kind: "nmos", pinOrder: ["S", "G", "D"], pinOrderSource: "TO-92 S-G-D, from memory of the 2N7000 datasheet [MEM]" },
  { pattern: /^BS170/, kind: "nmos", pinOrder: ["D", "G", "S"], pinOrderSource: "TO-92 D-G-S, from memory of the BS170 datasheet [MEM]" },
  { pattern: /^(2N7002|BSS138|BSS123)/, kind: "nmos", pinOrder: ["G", "S", "D"], pinOrderSource: "SOT-23 G-S-D, from memory of the datasheets [MEM]" },
  { pattern: /^(BS108|BS107|VN10K|VN2222|IRLML2502|IRLZ44N?|IRF5[1-4]0N?)/, kind: "nmos" },
  { pattern: /^(BS250|BSS84|TP0610|IRLML6402|IRF9[0-9]+)/, kind: "pmos" },
  // Zeners (before plain diodes; `1N47xx` would otherwise look like a rectifier).
  { pattern: /^(BZX\d+|BZT52|BZV55|BZV85|BZD27|1N47[2-6]\d|1N52[2-5]\d|1N53[3-8]\d|ZPD|ZMM|ZMY|MMSZ|TZMC|ZENER)/, kind: "zener" },
  { pattern: /^\d+V\d+$/, kind: "zener" },
  // Signal and rectifier diodes.
  { pattern: /^(1N4148|1N914|1N4448|LL4148|1N4150|BAS16|BAS21|BAV2[01]|BAW62|1N400[1-7]|1N581[7-9]|BAT4[1-9]|BAT54|BAT8[1-6]|1N5711|1N60|OA9[01])/, kind: "diode" }
];
function lookupPartName(name) {
  const n = name.trim().toUpperCase();
  if (n === "") return void 0;
  return KNOWN_PART_NAMES.find((k) => k.pattern.test(n));
}

// src/circuit/spice-number.ts
var SCALES = [
  // Order matters: `meg` and `mil` before `m`.
  ["meg", 1e6],
  ["mil", 254e-7],
  ["t", 1e12],
  ["g", 1e9],
  ["k", 1e3],
  ["m", 1e-3],
  ["u", 1e-6],
  ["\xB5", 1e-6],
  ["\u03BC", 1e-6],
  ["n", 1e-9],
  ["p", 1e-12],
  ["f", 1e-15]
];
var MANTISSA = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?/i;
function parseSpiceNumber(text) {
  const t = text.trim();
  const m = MANTISSA.exec(t);
  if (!m) return void 0;
  const base = Number(m[0]);
  if (!Number.isFinite(base)) return void 0;
  const rest = t.slice(m[0].length).toLowerCase();
  if (rest === "") return base;
  if (!/^[a-zµμΩ]+$/i.test(rest)) return void 0;
  for (const [letter, scale] of SCALES) {
    if (rest.startsWith(letter)) return base * scale;
  }
  return base;
}

// src/circuit/source-spec.ts
var WAVEFORMS = /* @__PURE__ */ new Set(["sin", "sine", "pulse", "pwl", "exp", "sffm", "am"]);
function tokens(text) {
  const out = [];
  let cur = "";
  let depth = 0;
  for (const ch of text) {
    if (ch === "(") depth++;
    if (ch === ")") depth = Math.max(0, depth - 1);
    if (depth === 0 && (ch === " " || ch === "	" || ch === ",")) {
      if (cur !== "") out.push(cur);
      cur = "";
      continue;
    }
    cur += ch;
  }
  if (cur !== "") out.push(cur);
  return out;
}
function parseSourceSpec(text) {
  const toks = tokens(text.trim());
  if (toks.length === 0) return { error: "empty source specification" };
  const spec = {};
  for (let i = 0; i < toks.length; i++) {
    const tok = toks[i] ?? "";
    const lower = tok.toLowerCase();
    const fn = /^([a-z]+)\s*\((.*)\)$/s.exec(lower);
    if (fn && WAVEFORMS.has(fn[1] ?? "")) {
      const name = fn[1] === "sine" ? "sin" : fn[1] ?? "";
      spec.waveform = name;
      const args = (fn[2] ?? "").split(/[\s,]+/).filter((a) => a !== "").map(parseSpiceNumber);
      if (args.some((a) => a === void 0)) return { error: `cannot read the arguments of '${tok}'` };
      const t0 = name === "pwl" ? args[1] : name === "am" ? args[2] : args[0];
      if (spec.dc === void 0 && t0 !== void 0) spec.dc = t0;
      continue;
    }
    if (lower === "dc" || lower === "ac") {
      const v2 = parseSpiceNumber(toks[i + 1] ?? "");
      if (v2 === void 0) return { error: `expected a number after '${tok}'` };
      i++;
      if (lower === "dc") spec.dc = v2;
      else {
        spec.ac = v2;
        const ph = parseSpiceNumber(toks[i + 1] ?? "");
        if (ph !== void 0) {
          spec.acPhase = ph;
          i++;
        }
      }
      continue;
    }
    const v = parseSpiceNumber(tok);
    if (v !== void 0 && i === 0) {
      spec.dc = v;
      continue;
    }
    return { error: `unexpected '${tok}' in a source specification` };
  }
  return spec;
}
function parseSimParams(text) {
  const out = {};
  const re = /([A-Za-z_][\w.]*)\s*=\s*(?:"([^"]*)"|'([^']*)'|([^\s"']+))/g;
  for (const m of text.matchAll(re)) {
    const key = (m[1] ?? "").toLowerCase();
    out[key] = m[2] ?? m[3] ?? m[4] ?? "";
  }
  return out;
}
function parseSimPins(text) {
  const out = {};
  for (const pair of text.trim().split(/\s+/)) {
    const m = /^([^=]+)=(.+)$/.exec(pair);
    if (m) out[m[1] ?? ""] = m[2] ?? "";
  }
  return out;
}

// src/circuit/classify.ts
var REQUIRED_ROLES = {
  resistor: ["1", "2"],
  capacitor: ["1", "2"],
  "polarized-capacitor": ["+", "-"],
  inductor: ["1", "2"],
  diode: ["A", "K"],
  zener: ["A", "K"],
  npn: ["B", "C", "E"],
  pnp: ["B", "C", "E"],
  njfet: ["G", "D", "S"],
  pjfet: ["G", "D", "S"],
  nmos: ["G", "D", "S"],
  pmos: ["G", "D", "S"],
  "dual-gate-mosfet": ["G1", "G2", "D", "S"],
  "voltage-source": ["+", "-"],
  "current-source": ["+", "-"],
  battery: ["+", "-"],
  connector: [],
  "power-flag": [],
  other: []
};
function field(fields, name) {
  const want = name.toLowerCase();
  for (const [k, v] of Object.entries(fields)) {
    if (k.toLowerCase() === want && v.trim() !== "" && v.trim() !== "~") return v.trim();
  }
  return void 0;
}
function splitLibId(libId) {
  const i = libId.indexOf(":");
  return i < 0 ? { lib: "", name: libId } : { lib: libId.slice(0, i), name: libId.slice(i + 1) };
}
function refPrefix(ref) {
  return /^#?[A-Za-z]*/.exec(ref)?.[0].toUpperCase() ?? "";
}
function kindFromSimDevice(device, libName) {
  switch (device.toUpperCase()) {
    case "R":
      return { kind: "resistor" };
    case "C":
      return { kind: isPolarizedName(libName) ? "polarized-capacitor" : "capacitor" };
    case "L":
      return { kind: "inductor" };
    case "D":
      return { family: "diode" };
    case "NPN":
      return { kind: "npn" };
    case "PNP":
      return { kind: "pnp" };
    case "NJFET":
      return { kind: "njfet" };
    case "PJFET":
      return { kind: "pjfet" };
    case "NMOS":
      return { kind: "nmos" };
    case "PMOS":
      return { kind: "pmos" };
    case "V":
      return { kind: /battery/i.test(libName) ? "battery" : "voltage-source" };
    case "I":
      return { kind: "current-source" };
    default:
      return void 0;
  }
}
function kindFromSpicePrimitive(prim, libName) {
  switch (prim.toUpperCase()) {
    case "R":
      return { kind: "resistor" };
    case "C":
      return { kind: isPolarizedName(libName) ? "polarized-capacitor" : "capacitor" };
    case "L":
      return { kind: "inductor" };
    case "D":
      return { family: "diode" };
    case "Q":
      return { family: "bjt" };
    case "J":
      return { family: "jfet" };
    case "M":
      return { family: "mos" };
    case "V":
      return { kind: /battery/i.test(libName) ? "battery" : "voltage-source" };
    case "I":
      return { kind: "current-source" };
    default:
      return void 0;
  }
}
function isPolarizedName(name) {
  return /^(C_Polarized|CP(\d|_|$)|C_Pol)/i.test(name);
}
function kindFromLibId(libId) {
  const { lib, name } = splitLibId(libId);
  if (/^power$/i.test(lib)) return { kind: "power-flag" };
  if (/^Connector/i.test(lib) || /^Conn_/i.test(name)) return { kind: "connector" };
  if (/^R(_Small)?(_US)?$/.test(name)) return { kind: "resistor" };
  if (isPolarizedName(name)) return { kind: "polarized-capacitor" };
  if (/^C(_Small)?(_US)?$|^C_(Variable|Trim)/.test(name)) return { kind: "capacitor" };
  if (/^L(_Small)?(_US)?$|^L_(Core|Ferrite|Iron|Air)/.test(name)) return { kind: "inductor" };
  if (/^D_Zener|^DZ(_|$)/i.test(name)) return { kind: "zener" };
  if (/^(D|D_Schottky|D_Small|LED)(_Small)?(_ALT)?(_Filled)?$/.test(name)) return { kind: "diode" };
  if (/^Battery(_Cell)?$/i.test(name)) return { kind: "battery" };
  let m = /^Q_(NPN|PNP)(_Darlington)?(_[BCE]+)?$/.exec(name);
  if (m) return { kind: m[1] === "NPN" ? "npn" : "pnp" };
  m = /^Q_(NJFET|PJFET)(_[DGS]+)?$/.exec(name);
  if (m) return { kind: m[1] === "NJFET" ? "njfet" : "pjfet" };
  if (/dual.?gate/i.test(name)) return { kind: "dual-gate-mosfet" };
  m = /^Q_(NMOS|PMOS)(_[DGSB]+)?$/.exec(name);
  if (m) return { kind: m[1] === "NMOS" ? "nmos" : "pmos" };
  if (/^Simulation_SPICE$/i.test(lib)) {
    if (name === "0") return { kind: "power-flag" };
    if (/^V[A-Z]*$/.test(name)) return { kind: "voltage-source" };
    if (/^I[A-Z]*$/.test(name)) return { kind: "current-source" };
    const sim = kindFromSimDevice(name, name);
    if (sim) return sim;
  }
  if (/^Transistor_BJT$/i.test(lib)) return { family: "bjt" };
  if (/^Transistor_FET$/i.test(lib)) return { family: "fet" };
  if (/^Diode$/i.test(lib)) return { family: "diode" };
  return void 0;
}
function kindFromRefPrefix(prefix, pinNames) {
  switch (prefix) {
    case "R":
      return { kind: "resistor" };
    case "C":
      return { kind: pinNames.includes("+") ? "polarized-capacitor" : "capacitor" };
    case "L":
      return { kind: "inductor" };
    case "D":
      return { family: "diode" };
    case "BT":
      return { kind: "battery" };
    case "V":
      return { kind: "voltage-source" };
    case "I":
      return { kind: "current-source" };
    case "J":
    case "P":
    case "CN":
    case "X":
      return { kind: "connector" };
    case "Q":
    case "T":
      return {};
    default:
      return prefix.startsWith("#") ? { kind: "power-flag" } : void 0;
  }
}
function cleanPinName(name) {
  const n = name.replace(/[~_^]\{([^}]*)\}/g, "$1").trim().toUpperCase().replace(/\u2212/g, "-");
  return n === "~" ? "" : n;
}
var ROLE_ALIASES = {
  B: ["B", "BASE"],
  C: ["C", "COLLECTOR", "COL"],
  E: ["E", "EMITTER", "EMIT"],
  G: ["G", "GATE"],
  D: ["D", "DRAIN"],
  S: ["S", "SOURCE"],
  G1: ["G1", "GATE1", "GATE 1", "GATE_1"],
  G2: ["G2", "GATE2", "GATE 2", "GATE_2"],
  A: ["A", "ANODE"],
  K: ["K", "CATHODE", "KATHODE"],
  "+": ["+", "POS", "PLUS", "P"],
  "-": ["-", "NEG", "MINUS", "N"],
  BULK: ["B", "BULK", "SUBSTRATE", "SUB"]
};
function roleOfName(name, kind) {
  const n = cleanPinName(name);
  if (n === "") return void 0;
  const want = [...REQUIRED_ROLES[kind]];
  if (kind === "nmos" || kind === "pmos") want.push("BULK");
  for (const role of want) {
    if ((ROLE_ALIASES[role] ?? [role]).includes(n)) return role === "BULK" ? "B" : role;
  }
  return void 0;
}
function pinNumbers(input) {
  const all = /* @__PURE__ */ new Set([...Object.keys(input.pinNames), ...Object.keys(input.pinTypes)]);
  return [...all].filter((p) => input.pinTypes[p] !== "no_connect").sort((a, b) => a.localeCompare(b, "en", { numeric: true }));
}
function assign(roles, role, pin) {
  if (roles[role] === void 0) roles[role] = pin;
}
function rolesFromNames(input, kind, pins) {
  const roles = {};
  for (const p of pins) {
    const role = roleOfName(input.pinNames[p] ?? "", kind);
    if (role) assign(roles, role, p);
  }
  return roles;
}
function rolesFromLibLetters(libId, kind, pins) {
  const { name } = splitLibId(libId);
  const m = /_([BCEGDS]{3,4})$/.exec(name);
  if (!m || !/^Q_/.test(name)) return {};
  const letters = [...m[1] ?? ""];
  const roles = {};
  const isFet = kind === "njfet" || kind === "pjfet" || kind === "nmos" || kind === "pmos";
  letters.forEach((letter, i) => {
    const pin = pins.includes(String(i + 1)) || pins.length === 0 ? String(i + 1) : pins[i];
    if (pin === void 0) return;
    if (isFet && !"GDSB".includes(letter)) return;
    if (!isFet && !"BCE".includes(letter)) return;
    assign(roles, letter, pin);
  });
  return roles;
}
function rolesFromSimPins(text, kind) {
  const roles = {};
  const pairs = parseSimPins(text);
  const needed = REQUIRED_ROLES[kind];
  const modelOrder = SPICE_NODE_ORDER[kind] ?? [];
  for (const [pin, modelPin] of Object.entries(pairs)) {
    const byName = roleOfName(modelPin, kind);
    if (byName) {
      assign(roles, byName, pin);
      continue;
    }
    const idx = Number(modelPin);
    const role = Number.isInteger(idx) ? modelOrder[idx - 1] : void 0;
    if (role && (needed.includes(role) || role === "B")) assign(roles, role, pin);
  }
  return roles;
}
var SPICE_NODE_ORDER = {
  resistor: ["1", "2"],
  capacitor: ["1", "2"],
  "polarized-capacitor": ["+", "-"],
  inductor: ["1", "2"],
  diode: ["A", "K"],
  zener: ["A", "K"],
  npn: ["C", "B", "E"],
  pnp: ["C", "B", "E"],
  njfet: ["D", "G", "S"],
  pjfet: ["D", "G", "S"],
  nmos: ["D", "G", "S", "B"],
  pmos: ["D", "G", "S", "B"],
  "voltage-source": ["+", "-"],
  "current-source": ["+", "-"],
  battery: ["+", "-"]
};
function rolesFromNodeSequence(text, kind) {
  const order = SPICE_NODE_ORDER[kind];
  if (!order) return {};
  const roles = {};
  text.trim().split(/[\s,]+/).forEach((pin, i) => {
    const role = order[i];
    if (role && pin !== "") assign(roles, role, pin);
  });
  return roles;
}
function rolesFromPackage(names, kind, pins) {
  for (const n of names) {
    const known = lookupPartName(n);
    if (!known?.pinOrder || known.kind !== kind) continue;
    const roles = {};
    known.pinOrder.forEach((role, i) => {
      const pin = String(i + 1);
      if (pins.length === 0 || pins.includes(pin)) assign(roles, role, pin);
    });
    return roles;
  }
  return {};
}
function rolesByNumber(kind, pins) {
  const [first, second] = pins.length >= 2 ? pins : ["1", "2"];
  if (first === void 0 || second === void 0 || pins.length > 2) return {};
  switch (kind) {
    case "resistor":
    case "capacitor":
    case "inductor":
      return { "1": first, "2": second };
    case "polarized-capacitor":
    case "battery":
    case "voltage-source":
    case "current-source":
      return { "+": first, "-": second };
    case "diode":
    case "zener":
      return { K: first, A: second };
    default:
      return {};
  }
}
function isComplete(roles, kind) {
  return REQUIRED_ROLES[kind].every((r) => roles[r] !== void 0);
}
function resolveRoles(input, kind) {
  const pins = pinNumbers(input);
  if (REQUIRED_ROLES[kind].length === 0) return {};
  const { name: symbolName2 } = splitLibId(input.libId);
  const passive = kind === "resistor" || kind === "capacitor" || kind === "inductor";
  const candidates3 = [];
  if (!passive) candidates3.push(rolesFromNames(input, kind, pins));
  candidates3.push(rolesFromLibLetters(input.libId, kind, pins));
  const simPins = field(input.fields, "Sim.Pins");
  if (simPins) candidates3.push(rolesFromSimPins(simPins, kind));
  const sequence = field(input.fields, "Spice_Node_Sequence");
  if (sequence) candidates3.push(rolesFromNodeSequence(sequence, kind));
  candidates3.push(rolesFromPackage([input.value, symbolName2], kind, pins));
  candidates3.push(rolesByNumber(kind, pins));
  const complete = candidates3.find((c) => isComplete(c, kind));
  if (complete) {
    const out = { ...complete };
    if ((kind === "nmos" || kind === "pmos") && out.B === void 0) {
      const bulk = rolesFromNames(input, kind, pins).B;
      if (bulk !== void 0 && !Object.values(out).includes(bulk)) out.B = bulk;
    }
    return out;
  }
  let best = {};
  for (const c of candidates3) if (Object.keys(c).length > Object.keys(best).length) best = c;
  return best;
}
var HINT_FIELDS = ["Description", "ki_description", "ki_keywords", "Sim.Name", "Spice_Model"];
function kindFromWords(text, family) {
  const t = ` ${text.toUpperCase()} `;
  const has = (re) => re.test(t);
  if (family === void 0 || family === "bjt") {
    if (has(/\bNPN\b/) && !has(/\bPNP\b/)) return "npn";
    if (has(/\bPNP\b/) && !has(/\bNPN\b/)) return "pnp";
  }
  if (family === void 0 || family === "fet" || family === "mos" || family === "jfet") {
    if (has(/DUAL[- ]?GATE|TETRODE/)) return "dual-gate-mosfet";
    const jfet = has(/JFET|\bJ-?FET\b|\bNJF\b|\bPJF\b/);
    const mos = has(/MOSFET|\bMOS\b|NMOS|PMOS/);
    const n = has(/\bN-?CHANNEL\b|\bN-CH\b|\bNCH\b|\bN-JFET\b|\bNJFET\b|\bNMOS\b|\bNJF\b/);
    const p = has(/\bP-?CHANNEL\b|\bP-CH\b|\bPCH\b|\bP-JFET\b|\bPJFET\b|\bPMOS\b|\bPJF\b/);
    if (n !== p) {
      if (jfet || family === "jfet") return n ? "njfet" : "pjfet";
      if (mos || family === "mos") return n ? "nmos" : "pmos";
    }
  }
  if (family === void 0 || family === "diode") {
    if (has(/ZENER/)) return "zener";
  }
  return void 0;
}
function fitsFamily(kind, family) {
  switch (family) {
    case void 0:
      return true;
    case "bjt":
      return kind === "npn" || kind === "pnp";
    case "jfet":
      return kind === "njfet" || kind === "pjfet";
    case "mos":
      return kind === "nmos" || kind === "pmos" || kind === "dual-gate-mosfet";
    case "fet":
      return kind === "njfet" || kind === "pjfet" || kind === "nmos" || kind === "pmos" || kind === "dual-gate-mosfet";
    case "diode":
      return kind === "diode" || kind === "zener";
  }
}
function candidateNames(input) {
  const names = [input.value, splitLibId(input.libId).name];
  for (const f of ["Sim.Name", "Spice_Model"]) {
    const v = field(input.fields, f);
    if (v) names.push(v, v.replace(/^[QDJM](?=\d)/i, ""));
  }
  return names.filter((n) => n.trim() !== "");
}
function pinNameSet(input) {
  return Object.values(input.pinNames).map(cleanPinName).filter((n) => n !== "");
}
function familyFromPins(names) {
  const has = (n) => names.includes(n);
  if (has("G1") && has("G2") && has("D") && has("S")) return { kind: "dual-gate-mosfet" };
  if (has("B") && has("C") && has("E")) return { family: "bjt" };
  if (has("G") && has("D") && has("S")) return { family: "fet" };
  if (has("A") && has("K")) return { family: "diode" };
  return {};
}
function classifyPart(input) {
  const { name: symbolName2 } = splitLibId(input.libId);
  if (input.isPowerSymbol) return { kind: "power-flag", roles: {} };
  const pinNames = pinNameSet(input);
  const evidence = [];
  const simDevice = field(input.fields, "Sim.Device");
  if (simDevice) {
    const s = kindFromSimDevice(simDevice, symbolName2);
    if (s) evidence.push(s);
  }
  const prim = field(input.fields, "Spice_Primitive");
  if (prim) {
    const s = kindFromSpicePrimitive(prim, symbolName2);
    if (s) evidence.push(s);
  }
  const fromLib = kindFromLibId(input.libId);
  if (fromLib) evidence.push(fromLib);
  const fromPins = familyFromPins(pinNames);
  let kind = evidence.find((e) => e.kind !== void 0)?.kind;
  const family = evidence.find((e) => e.family !== void 0)?.family ?? fromPins.family;
  if (kind === void 0) {
    for (const n of candidateNames(input)) {
      const known = lookupPartName(n);
      if (known && fitsFamily(known.kind, family)) {
        kind = known.kind;
        break;
      }
    }
  }
  if (kind === "diode") {
    const known = candidateNames(input).map(lookupPartName).find((k) => k !== void 0);
    if (known?.kind === "zener") kind = "zener";
  }
  if (kind === void 0 && fromPins.kind) kind = fromPins.kind;
  if (kind === void 0) {
    const words3 = [symbolName2, input.value, ...HINT_FIELDS.map((f) => field(input.fields, f) ?? "")].join(" ");
    const fromWords = kindFromWords(words3, family);
    if (fromWords && fitsFamily(fromWords, family)) kind = fromWords;
  }
  if (kind === void 0 && family === "diode") kind = "diode";
  if (kind === void 0 && family === void 0) {
    const byRef2 = kindFromRefPrefix(refPrefix(input.ref), pinNames);
    if (byRef2?.kind) kind = byRef2.kind;
    else if (byRef2?.family === "diode") kind = "diode";
  }
  if (kind === void 0) kind = "other";
  return { kind, roles: resolveRoles(input, kind) };
}

// src/circuit/value.ts
var QUANTITY_OF_KIND = {
  resistor: { unit: "\u03A9", noun: "resistance" },
  capacitor: { unit: "F", noun: "capacitance" },
  "polarized-capacitor": { unit: "F", noun: "capacitance" },
  inductor: { unit: "H", noun: "inductance" },
  "voltage-source": { unit: "V", noun: "voltage" },
  battery: { unit: "V", noun: "voltage" },
  "current-source": { unit: "A", noun: "current" }
};
var NOUN_OF_UNIT = {
  "\u03A9": "resistance",
  F: "capacitance",
  H: "inductance",
  V: "voltage",
  A: "current",
  Hz: "frequency",
  W: "power"
};
var MULTIPLIERS = {
  f: 1e-15,
  p: 1e-12,
  P: 1e-12,
  n: 1e-9,
  N: 1e-9,
  u: 1e-6,
  U: 1e-6,
  m: 1e-3,
  k: 1e3,
  K: 1e3,
  M: 1e6,
  meg: 1e6,
  Meg: 1e6,
  MEG: 1e6,
  G: 1e9,
  T: 1e12
};
var MULTIPLIER_KEYS = Object.keys(MULTIPLIERS).sort((a, b) => b.length - a.length);
var UNIT_SPELLINGS = [
  { text: "\u03A9", unit: "\u03A9" },
  { text: "ohms", unit: "\u03A9" },
  { text: "ohm", unit: "\u03A9" },
  { text: "Ohms", unit: "\u03A9" },
  { text: "Ohm", unit: "\u03A9" },
  { text: "OHMS", unit: "\u03A9" },
  { text: "OHM", unit: "\u03A9" },
  { text: "R", unit: "\u03A9" },
  { text: "E", unit: "\u03A9" },
  { text: "F", unit: "F" },
  { text: "f", unit: "F", afterMultiplierOnly: true },
  { text: "H", unit: "H" },
  { text: "h", unit: "H", afterMultiplierOnly: true },
  { text: "V", unit: "V" },
  { text: "v", unit: "V" },
  { text: "A", unit: "A" },
  { text: "Hz", unit: "Hz" },
  { text: "HZ", unit: "Hz" },
  { text: "hz", unit: "Hz" },
  { text: "W", unit: "W" }
];
function normalise(text) {
  return text.replace(/[\u00B5\u03BC]/g, "u").replace(/\u2126/g, "\u03A9").replace(/\u2212/g, "-");
}
function tokenise(s) {
  const out = [];
  let cur = "";
  let start = 0;
  const flush = (end) => {
    if (cur !== "") out.push({ text: cur, start, end });
    cur = "";
  };
  for (let i = 0; i < s.length; i++) {
    const ch = s[i] ?? "";
    const prev = s[i - 1] ?? "";
    const next = s[i + 1] ?? "";
    let separates = false;
    if (/\s/.test(ch) || ch === ";") separates = true;
    else if (ch === "/") separates = !(/\d/.test(prev) && /\d/.test(next));
    else if (ch === ",") separates = !(/^[+-]?\d+$/.test(cur) && /\d/.test(next));
    if (separates) {
      flush(i);
      start = i + 1;
      continue;
    }
    if (cur === "") start = i;
    cur += ch;
  }
  flush(s.length);
  return out;
}
function decimal(sign, mantissa, exp10) {
  const m = mantissa.startsWith(".") ? `0${mantissa}` : mantissa.endsWith(".") ? `${mantissa}0` : mantissa;
  return Number(`${sign === "-" ? "-" : ""}${m}e${exp10}`);
}
function withArticle(noun) {
  return /^[aeiou]/.test(noun) ? `an ${noun}` : `a ${noun}`;
}
function suffixReadings(suffix) {
  const out = [];
  for (const mult of ["", ...MULTIPLIER_KEYS]) {
    if (!suffix.startsWith(mult)) continue;
    const rest = suffix.slice(mult.length);
    if (rest === "") {
      if (mult !== "") out.push({ multiplier: mult, unitText: "" });
      continue;
    }
    for (const sp of UNIT_SPELLINGS) {
      if (sp.text !== rest) continue;
      if (sp.afterMultiplierOnly && mult === "") continue;
      out.push({ multiplier: mult, unitText: sp.text, unit: sp.unit });
    }
  }
  if (suffix === "") out.push({ multiplier: "", unitText: "" });
  return out;
}
function pickSuffix(suffix, expected) {
  const readings = suffixReadings(suffix);
  const fits = readings.find((r) => r.unit === expected.unit) ?? readings.find((r) => r.unit === void 0);
  if (fits) return fits;
  const other = readings.find((r) => r.unit !== void 0);
  return other?.unit !== void 0 ? { wrongUnit: other.unit } : void 0;
}
var RKM_INFIX = /^([+-]?)(\d+)(meg|Meg|MEG|[fpnumkKMGTPNURE])(\d+)(.*)$/;
var RKM_LEADING = /^(R|E|[pnumkKMG])(\d+)(.*)$/;
var PREFIXED = /^([+-]?)(\d+(?:[.,]\d*)?|[.,]\d+)(?:[eE]([+-]?\d+))?(.*)$/;
function readNumberToken(token, expected) {
  const isResistor = expected.unit === "\u03A9";
  const rkm = RKM_INFIX.exec(token);
  const lead = rkm ? null : RKM_LEADING.exec(token);
  if (rkm || lead) {
    const sign = rkm ? rkm[1] ?? "" : "";
    const whole = rkm ? rkm[2] ?? "" : "0";
    const letter = rkm ? rkm[3] ?? "" : lead?.[1] ?? "";
    const frac = rkm ? rkm[4] ?? "" : lead?.[2] ?? "";
    const unitText = rkm ? rkm[5] ?? "" : lead?.[3] ?? "";
    const ohmLetter = letter === "R" || letter === "E";
    if (ohmLetter && !isResistor) {
      const asPrefixed = readPrefixed(token, expected);
      if (asPrefixed.ok) return asPrefixed;
      return { ok: false, reason: `'${letter}' in place of the decimal point is the resistor code` };
    }
    const scale = ohmLetter ? 1 : MULTIPLIERS[letter];
    if (scale === void 0) return { ok: false };
    let unit = ohmLetter ? "\u03A9" : void 0;
    if (unitText !== "") {
      const sp = UNIT_SPELLINGS.find((u) => u.text === unitText);
      if (!sp) return { ok: false };
      if (sp.unit !== expected.unit) return { ok: false, reason: `the unit ${sp.unit} is for ${withArticle(NOUN_OF_UNIT[sp.unit] ?? sp.unit)}` };
      unit = sp.unit;
    }
    return {
      ok: true,
      reading: {
        number: decimal(sign, `${whole}.${frac}`, Math.round(Math.log10(scale))),
        ...unit !== void 0 ? { unit } : {},
        style: "rkm",
        mantissaText: `${whole}.${frac}`,
        multiplierText: letter,
        unitText,
        leadingZero: rkm !== null && whole === "0",
        letterFirst: lead !== null
      }
    };
  }
  return readPrefixed(token, expected);
}
function readPrefixed(token, expected) {
  const pre = PREFIXED.exec(token);
  if (!pre) return { ok: false };
  const sign = pre[1] ?? "";
  const mantissaText = pre[2] ?? "";
  const exponent = pre[3];
  const suffix = pre[4] ?? "";
  const picked = pickSuffix(suffix, expected);
  if (picked === void 0) return { ok: false };
  if ("wrongUnit" in picked) {
    return { ok: false, reason: `the unit ${picked.wrongUnit} is for ${withArticle(NOUN_OF_UNIT[picked.wrongUnit] ?? picked.wrongUnit)}` };
  }
  const scale = picked.multiplier === "" ? 1 : MULTIPLIERS[picked.multiplier] ?? 1;
  const number = decimal(sign, mantissaText.replace(",", "."), Number(exponent ?? 0) + Math.round(Math.log10(scale)));
  const style = picked.unitText === "R" || picked.unitText === "E" ? "rkm" : picked.unit !== void 0 ? "prefix-unit" : picked.multiplier !== "" ? "prefix" : "plain";
  return {
    ok: true,
    reading: {
      number,
      ...picked.unit !== void 0 ? { unit: picked.unit } : {},
      style,
      mantissaText,
      multiplierText: picked.multiplier,
      unitText: picked.unitText,
      leadingZero: false,
      letterFirst: false
    }
  };
}
function readMain(toks, expected) {
  const first = toks[0];
  if (!first) return { reason: void 0 };
  const second = toks[1];
  if (second && /^[+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)$/.test(first.text) && !/\d/.test(second.text)) {
    const joined = readNumberToken(first.text + second.text, expected);
    if (joined.ok && joined.reading.style !== "plain") {
      return { reading: joined.reading, start: first.start, end: second.end, spaced: true, consumed: 2 };
    }
    if (!joined.ok && joined.reason !== void 0) return { reason: joined.reason };
  }
  const single = readNumberToken(first.text, expected);
  if (single.ok) return { reading: single.reading, start: first.start, end: first.end, spaced: false, consumed: 1 };
  if (single.reason === void 0 && toks.length === 1 && /^[RCL]$/.test(first.text)) {
    return { reason: "that is the symbol's placeholder, not a value" };
  }
  return { reason: single.reason };
}
function readAttribute(token, bareAs) {
  const t = normalise(token).trim().replace(/^±/, "");
  const dec = (x) => Number(x.replace(",", "."));
  let m = /^(\d+(?:[.,]\d+)?)\s*%$/.exec(t);
  if (m) return { tolerance: dec(m[1] ?? "") / 100 };
  m = /^(\d+)\s*\/\s*(\d+)\s*W$/.exec(t);
  if (m && Number(m[2]) !== 0) return { powerRating: Number(m[1]) / Number(m[2]) };
  m = /^(\d+(?:[.,]\d+)?)\s*(m|k)?W$/.exec(t);
  if (m) return { powerRating: dec(m[1] ?? "") * (m[2] === "m" ? 1e-3 : m[2] === "k" ? 1e3 : 1) };
  m = /^(\d+(?:[.,]\d+)?)\s*(m|k)?V(?:DC|dc|AC|ac)?$/.exec(t);
  if (m) return { voltageRating: dec(m[1] ?? "") * (m[2] === "m" ? 1e-3 : m[2] === "k" ? 1e3 : 1) };
  m = /^(\d+)V(\d+)$/.exec(t);
  if (m) return { voltageRating: Number(`${m[1]}.${m[2]}`) };
  m = /^(\d+(?:[.,]\d+)?)$/.exec(t);
  if (m && bareAs) {
    const v = dec(m[1] ?? "");
    if (bareAs === "%") return { tolerance: v / 100 };
    if (bareAs === "W") return { powerRating: v };
    return { voltageRating: v };
  }
  return {};
}
var RATING_FIELDS = {
  voltage: "V",
  "voltage rating": "V",
  "rated voltage": "V",
  rating: "V",
  v: "V",
  tolerance: "%",
  tol: "%",
  power: "W",
  "power rating": "W"
};
function attributesFromFields(fields) {
  const out = {};
  for (const [name, raw] of Object.entries(fields)) {
    const bareAs = RATING_FIELDS[name.trim().toLowerCase()];
    if (!bareAs || raw.trim() === "" || raw.trim() === "~") continue;
    const a = readAttribute(raw, bareAs);
    if (a.voltageRating !== void 0 && out.voltageRating === void 0) out.voltageRating = a.voltageRating;
    if (a.tolerance !== void 0 && out.tolerance === void 0) out.tolerance = a.tolerance;
    if (a.powerRating !== void 0 && out.powerRating === void 0) out.powerRating = a.powerRating;
  }
  return out;
}
function attributesFromTokens(toks) {
  const out = {};
  for (const tok of toks) {
    const a = readAttribute(tok.text);
    if (a.voltageRating !== void 0) out.voltageRating ??= a.voltageRating;
    if (a.tolerance !== void 0) out.tolerance ??= a.tolerance;
    if (a.powerRating !== void 0) out.powerRating ??= a.powerRating;
  }
  return out;
}
function mergeAttributes(target, fromValue, fromFields) {
  const v = fromFields.voltageRating ?? fromValue.voltageRating;
  const t = fromFields.tolerance ?? fromValue.tolerance;
  const p = fromFields.powerRating ?? fromValue.powerRating;
  if (v !== void 0) target.voltageRating = v;
  if (t !== void 0) target.tolerance = t;
  if (p !== void 0) target.powerRating = p;
}
function isEmptyValue(text) {
  const t = text.trim();
  return t === "" || t === "~";
}
function ambiguousCommaWarning(reading, text) {
  if (!/^\d{1,3},\d{3}$/.test(reading.mantissaText)) return void 0;
  const asDecimal = reading.mantissaText.replace(",", ".");
  const asThousands = reading.mantissaText.replace(",", "");
  return `'${text}' has a comma that may be a decimal comma or a thousands separator: read as ${asDecimal}, not ${asThousands}; write ${asDecimal.replace(/0+$/, "")} or ${asThousands} with no comma to make it plain`;
}
function bareNumberWarning(reading, quantity, text) {
  if (reading.style !== "plain" || reading.number < 1e-3) return void 0;
  if (quantity.unit !== "F" && quantity.unit !== "H") return void 0;
  const micro = quantity.unit === "F" ? "uF" : "uH";
  return `'${text}' has no multiplier and reads as ${reading.number} ${quantity.unit}; write ${text}${micro} if micro${quantity.unit === "F" ? "farads" : "henries"} were meant`;
}
function parseValue(text, kind, fields) {
  const quantity = QUANTITY_OF_KIND[kind];
  const out = { text };
  const fromFields = attributesFromFields(fields);
  if (!quantity) {
    mergeAttributes(out, {}, fromFields);
    return out;
  }
  if (isEmptyValue(text)) {
    if (kind !== "voltage-source" && kind !== "current-source") out.problem = `the value is empty: expected ${withArticle(quantity.noun)}`;
    mergeAttributes(out, {}, fromFields);
    return out;
  }
  if (kind === "voltage-source" || kind === "current-source") {
    const sourced = readSourceValue(text, quantity);
    if (sourced) {
      Object.assign(out, sourced);
      mergeAttributes(out, {}, fromFields);
      return out;
    }
  }
  const s = normalise(text.trim());
  const toks = tokenise(s);
  const main = readMain(toks, quantity);
  if ("reason" in main) {
    const why = main.reason ? `: ${main.reason}` : "";
    out.problem = `cannot read '${text.trim()}' as ${withArticle(quantity.noun)}${why}`;
    mergeAttributes(out, {}, fromFields);
    return out;
  }
  const { reading } = main;
  const isPassive = quantity.unit === "\u03A9" || quantity.unit === "F" || quantity.unit === "H";
  if (isPassive && reading.number < 0) {
    out.problem = `'${text.trim()}' is negative: ${withArticle(quantity.noun)} must be zero or more`;
    return out;
  }
  out.number = reading.number;
  out.unit = quantity.unit;
  out.style = reading.style;
  const warning = ambiguousCommaWarning(reading, text.trim()) ?? bareNumberWarning(reading, quantity, text.trim());
  if (warning) out.warning = warning;
  mergeAttributes(out, attributesFromTokens(toks.slice(main.consumed)), fromFields);
  return out;
}
function readSourceValue(text, quantity) {
  const t = text.trim();
  if (!/^(dc|ac|sin|sine|pulse|pwl|exp|sffm|am)\b/i.test(t)) return void 0;
  const spec = parseSourceSpec(t);
  if ("error" in spec) return { problem: `cannot read '${t}' as a source: ${spec.error}` };
  return spec.dc !== void 0 ? { number: spec.dc, unit: quantity.unit, style: "plain" } : { unit: quantity.unit };
}
function spellingOf(example, quantity) {
  const original = example.text.trim();
  const offset = example.text.indexOf(original);
  const s = normalise(original);
  const toks = tokenise(s);
  const main = readMain(toks, quantity);
  if ("reason" in main) return void 0;
  const r = main.reading;
  const letter = r.multiplierText;
  const writtenLetter = original.slice(0, main.end).match(/[\u00B5\u03BCuU]/)?.[0];
  const letters = /* @__PURE__ */ new Map();
  const scale = MULTIPLIERS[letter];
  if (scale !== void 0) letters.set(scale, letter === "u" || letter === "U" ? writtenLetter ?? letter : letter);
  return {
    style: r.style,
    spaced: main.spaced,
    decimalComma: r.mantissaText.includes(","),
    unitText: r.unitText,
    letters,
    kiloUpper: letter === "K",
    microChar: letter === "u" || letter === "U" ? writtenLetter ?? "u" : "u",
    megText: /^(meg|Meg|MEG)$/.test(letter) ? letter : "M",
    ohmLetter: letter === "E" || r.unitText === "E" ? "E" : "R",
    leadingZero: r.leadingZero,
    start: offset + main.start,
    end: offset + main.end
  };
}
var SCALE_LADDER = {
  "\u03A9": [1, 1e3, 1e6, 1e9],
  F: [1e-12, 1e-9, 1e-6],
  H: [1e-9, 1e-6, 1e-3, 1],
  V: [1e-3, 1, 1e3],
  A: [1e-9, 1e-6, 1e-3, 1]
};
function trimNumber(x) {
  return String(Number(x.toPrecision(4)));
}
function chooseScale(value, ladder) {
  const abs = Math.abs(value);
  let scale = ladder[0] ?? 1;
  for (const s of ladder) if (abs >= s * (1 - 1e-9)) scale = s;
  let mantissa = Number((value / scale).toPrecision(4));
  const idx = ladder.indexOf(scale);
  const up = ladder[idx + 1];
  if (up !== void 0 && Math.abs(mantissa) >= up / scale) {
    scale = up;
    mantissa = Number((value / scale).toPrecision(4));
  }
  return { scale, mantissa };
}
function letterFor(scale, sp, quantity) {
  const used = sp?.letters.get(scale);
  if (used !== void 0) return used;
  switch (scale) {
    case 1e-15:
      return "f";
    case 1e-12:
      return "p";
    case 1e-9:
      return "n";
    case 1e-6:
      return sp?.microChar ?? "u";
    case 1e-3:
      return "m";
    case 1:
      return quantity.unit === "\u03A9" && sp?.style === "rkm" ? sp.ohmLetter : "";
    case 1e3:
      return sp?.kiloUpper ? "K" : "k";
    case 1e6:
      return sp?.megText ?? "M";
    case 1e9:
      return "G";
    default:
      return "T";
  }
}
function formatWith(value, quantity, sp) {
  const style = sp?.style ?? "prefix";
  const ladder = SCALE_LADDER[quantity.unit] ?? [1];
  if (style === "plain") {
    const plain = trimNumber(value);
    if (!plain.includes("e") && plain.length <= 9) return sp?.decimalComma ? plain.replace(".", ",") : plain;
  }
  const { scale, mantissa } = chooseScale(value, ladder);
  const letter = letterFor(scale, sp, quantity);
  const digits = trimNumber(mantissa);
  if (style === "rkm" && letter !== "") {
    const [whole, frac] = digits.split(".");
    const unitSuffix = sp && sp.unitText !== "R" && sp.unitText !== "E" ? sp.unitText : "";
    if (frac === void 0) return `${whole}${letter}${unitSuffix}`;
    if (whole === "0" && !sp?.leadingZero) return `${letter}${frac}${unitSuffix}`;
    return `${whole}${letter}${frac}${unitSuffix}`;
  }
  const num = sp?.decimalComma ? digits.replace(".", ",") : digits;
  const unitText = style === "prefix-unit" ? sp?.unitText ?? quantity.unit : "";
  const gap = sp?.spaced ? " " : "";
  const suffix = `${letter}${unitText}`;
  return suffix === "" ? num : `${num}${gap}${suffix}`;
}
function rewriteValueText(value, kind, example) {
  const quantity = QUANTITY_OF_KIND[kind] ?? { unit: "", noun: "value" };
  const sp = example.number !== void 0 ? spellingOf(example, quantity) : void 0;
  const written = formatWith(value, quantity, sp);
  if (!sp) return written;
  return example.text.slice(0, sp.start) + written + example.text.slice(sp.end);
}

// src/read/natural-order.ts
var CHUNK = /(\d+|\D+)/g;
function naturalCompare(a, b) {
  if (a === b) return 0;
  const ca = a.match(CHUNK) ?? [];
  const cb = b.match(CHUNK) ?? [];
  const n = Math.min(ca.length, cb.length);
  for (let i = 0; i < n; i++) {
    const x = ca[i] ?? "";
    const y = cb[i] ?? "";
    if (x === y) continue;
    const dx = x.charCodeAt(0) >= 48 && x.charCodeAt(0) <= 57;
    const dy = y.charCodeAt(0) >= 48 && y.charCodeAt(0) <= 57;
    if (dx && dy) {
      const nx = x.replace(/^0+(?=\d)/, "");
      const ny = y.replace(/^0+(?=\d)/, "");
      if (nx.length !== ny.length) return nx.length - ny.length;
      if (nx !== ny) return nx < ny ? -1 : 1;
      continue;
    }
    return x < y ? -1 : 1;
  }
  if (ca.length !== cb.length) return ca.length - cb.length;
  return a < b ? -1 : 1;
}
function comparePins(a, b) {
  return naturalCompare(a.ref, b.ref) || naturalCompare(a.pin, b.pin);
}

// src/read/part-builder.ts
function buildPart(input) {
  const { kind, roles } = classifyPart({
    ref: input.ref,
    libId: input.libId,
    value: input.value,
    pinNames: input.pinNames,
    pinTypes: input.pinTypes,
    fields: input.fields,
    isPowerSymbol: false
  });
  const part = {
    ref: input.ref,
    value: input.value,
    parsed: parseValue(input.value, kind, input.fields),
    kind,
    libId: input.libId,
    footprint: input.footprint,
    pins: sortedRecord(input.pins),
    pinNames: sortedRecord(input.pinNames),
    roles,
    fields: input.fields,
    dnp: input.dnp,
    excludedFromSim: input.excludedFromSim,
    origin: input.origin
  };
  if (input.valueSpan) part.valueSpan = input.valueSpan;
  return part;
}
function sortedRecord(r) {
  const out = {};
  for (const k of Object.keys(r).sort(naturalCompare)) out[k] = r[k] ?? "";
  return out;
}
function sortCircuit(parts, nets) {
  for (const n of nets) n.pins.sort(comparePins);
  nets.sort((a, b) => naturalCompare(a.name, b.name));
  parts.sort((a, b) => naturalCompare(a.ref, b.ref));
}

// src/read/kicad-net.ts
var BOOKKEEPING = /* @__PURE__ */ new Set(["sheetname", "sheetfile", "ki_keywords", "ki_fp_filters", "ki_description", "ki_locked"]);
var FLAG_PROPERTIES = /* @__PURE__ */ new Set(["dnp", "exclude_from_bom", "exclude_from_board", "exclude_from_sim"]);
var FALSE_TEXT2 = /* @__PURE__ */ new Set(["", "0", "n", "no", "false", "off"]);
function attr(list2, key) {
  if (!list2) return "";
  const t = argText(childOf(list2, key), 1) ?? "";
  return t === "~" ? "" : t;
}
function fieldValue(field3) {
  for (let i = 1; i < field3.content.length; i++) {
    const t = textOf(field3.content[i]);
    if (t !== void 0) return t === "~" ? "" : t;
  }
  return "";
}
function readNetlistTree(tree, file, fs, projectRoot) {
  const root = tree.nodes[0];
  if (!root || root.type !== "list") {
    return { ok: false, error: { file, line: 1, column: 1, message: 'not a KiCad netlist: expected "(export" at the start' } };
  }
  const notes = [];
  const version = argText(childOf(root, "version"), 1) ?? "";
  if (version !== "D" && version !== "E") {
    const p = where(childOf(root, "version") ?? root);
    notes.push({ file, line: p.line, column: p.column, message: `netlist version "${version}" is not D or E; reading it anyway` });
  }
  const libParts = /* @__PURE__ */ new Map();
  const libSection = childOf(root, "libparts");
  for (const lp of libSection ? childrenOf(libSection, "libpart") : []) {
    const entry = { names: {}, types: {} };
    const pins = childOf(lp, "pins");
    for (const pin of pins ? childrenOf(pins, "pin") : []) {
      const num = attr(pin, "num");
      if (num === "") continue;
      entry.names[num] = attr(pin, "name");
      entry.types[num] = attr(pin, "type");
    }
    libParts.set(`${attr(lp, "lib")}:${attr(lp, "part")}`, entry);
  }
  const comps = /* @__PURE__ */ new Map();
  const compSection = childOf(root, "components");
  for (const comp of compSection ? childrenOf(compSection, "comp") : []) {
    const ref = attr(comp, "ref");
    if (ref === "") {
      const p = where(comp);
      notes.push({ file, line: p.line, column: p.column, message: "component without a reference; ignored" });
      continue;
    }
    if (ref.startsWith("#")) continue;
    comps.set(ref, { list: comp, ref, pins: {}, pinNames: {}, pinTypes: {} });
  }
  const nets = [];
  const netSection = childOf(root, "nets");
  const unknownRefs = /* @__PURE__ */ new Set();
  for (const net of netSection ? childrenOf(netSection, "net") : []) {
    const name = unescapeKicad(attr(net, "name"));
    const pins = [];
    let noConnect = name.startsWith("unconnected-(");
    let powerPin = false;
    for (const node of childrenOf(net, "node")) {
      const ref = attr(node, "ref");
      const pin = attr(node, "pin");
      const pintype = attr(node, "pintype");
      if (pintype.includes("+no_connect") || pintype.startsWith("no_connect")) noConnect = true;
      if (pintype.startsWith("power_in") || pintype.startsWith("power_out")) powerPin = true;
      const comp = comps.get(ref);
      if (!comp) {
        if (!ref.startsWith("#") && !unknownRefs.has(ref)) {
          unknownRefs.add(ref);
          const p = where(node);
          notes.push({ file, line: p.line, column: p.column, ref, message: `net ${name} lists ${ref}, which is not among the components; ignored` });
        }
        continue;
      }
      comp.pins[pin] = name;
      const fn = attr(node, "pinfunction");
      if (fn !== "" && comp.pinNames[pin] === void 0) comp.pinNames[pin] = fn;
      if (pintype !== "" && comp.pinTypes[pin] === void 0) comp.pinTypes[pin] = pintype.replace("+no_connect", "");
      pins.push({ ref, pin });
    }
    if (pins.length === 0) continue;
    const globalName = !name.includes("/") && !name.startsWith("Net-(") && !name.startsWith("unconnected-(");
    const isGround = globalName && isGroundName(name);
    nets.push({
      name,
      aliases: [name],
      pins,
      isGround,
      // No power symbols in a netlist: a global name on a supply pin, or a rail-like name, is power (heuristic).
      isPower: isGround || globalName && (powerPin || /^([+-]\d|V(CC|DD|EE|SS|BAT|IN)\b|\+)/i.test(name)),
      noConnect
    });
  }
  const parts = [];
  for (const c of comps.values()) parts.push(buildNetlistPart(c, libParts, file));
  const sheets = [];
  const design2 = childOf(root, "design");
  for (const sheet of design2 ? childrenOf(design2, "sheet") : []) {
    sheets.push({ path: unescapeKicad(attr(sheet, "name")), file: attr(childOf(sheet, "title_block"), "source") });
  }
  sortCircuit(parts, nets);
  const circuit = {
    file,
    format: "kicad_net",
    version,
    parts,
    nets,
    sheets,
    notes,
    modelLibraries: loadModelLibraries(parts, fs, projectRoot, notes)
  };
  return { ok: true, circuit };
  function buildNetlistPart(c, libs, netFile) {
    const comp = c.list;
    const libsource = childOf(comp, "libsource");
    const libId = libsource ? `${attr(libsource, "lib")}:${attr(libsource, "part")}` : "";
    const lib = libs.get(libId);
    const fields = {};
    const datasheet = attr(comp, "datasheet");
    if (datasheet !== "") fields["Datasheet"] = datasheet;
    const description = attr(comp, "description");
    if (description !== "") fields["Description"] = description;
    const fieldList = childOf(comp, "fields");
    for (const f of fieldList ? childrenOf(fieldList, "field") : []) {
      const n = attr(f, "name");
      if (n !== "" && n.toLowerCase() !== "footprint") fields[n] = fieldValue(f);
    }
    const flags = /* @__PURE__ */ new Set();
    for (const prop of childrenOf(comp, "property")) {
      const n = attr(prop, "name");
      const lower = n.toLowerCase();
      if (FLAG_PROPERTIES.has(lower)) {
        flags.add(lower);
        continue;
      }
      if (n === "" || BOOKKEEPING.has(lower) || fields[n] !== void 0) continue;
      fields[n] = attr(prop, "value");
    }
    const sheetPath = unescapeKicad(attr(childOf(comp, "sheetpath"), "names")) || "/";
    const fieldFlag = (names, falseMeansSet) => Object.entries(fields).some(([k, v]) => names.includes(k.toLowerCase()) && (falseMeansSet ? FALSE_TEXT2.has(v.trim().toLowerCase()) && v.trim() !== "" : !FALSE_TEXT2.has(v.trim().toLowerCase())));
    const pinNames = {};
    const pinTypes = {};
    for (const pin of Object.keys(c.pins)) {
      pinNames[pin] = lib?.names[pin] ?? c.pinNames[pin] ?? "";
      pinTypes[pin] = lib?.types[pin] ?? c.pinTypes[pin] ?? "";
    }
    const p = where(comp);
    return buildPart({
      ref: c.ref,
      value: attr(comp, "value"),
      libId,
      footprint: attr(comp, "footprint"),
      pins: c.pins,
      pinNames,
      pinTypes,
      fields,
      dnp: flags.has("dnp") || fieldFlag(["dnp", "dnf"], false),
      excludedFromSim: flags.has("exclude_from_sim") || fieldFlag(["sim.enable", "spice_netlist_enabled"], true),
      origin: { file: netFile, line: p.line, column: p.column, sheetPath }
    });
  }
}

// src/read/kicad-sch/read-schematic.ts
import { dirname as dirname2 } from "node:path";

// src/read/kicad-sch/instance-symbols.ts
var sheetPathKeys = /* @__PURE__ */ new WeakMap();
function pathKeys(inst, root) {
  let keys = sheetPathKeys.get(inst);
  if (!keys) {
    keys = { v7: "/" + [root.uuid, ...inst.uuidPath].join("/"), v6Prefix: "/" + inst.uuidPath.map((u) => `${u}/`).join("") };
    sheetPathKeys.set(inst, keys);
  }
  return keys;
}
function resolveSymbol(sym, inst, root) {
  const keys = pathKeys(inst, root);
  let data = sym.instances.size > 0 ? sym.instances.get(keys.v7) : void 0;
  let dataFile = inst.sheet.file;
  if (!data) {
    data = root.symbolInstances.size > 0 ? root.symbolInstances.get(keys.v6Prefix + sym.uuid) : void 0;
    dataFile = root.file;
  }
  if (!data) {
    data = sym.defaultInstance;
    dataFile = inst.sheet.file;
  }
  const out = {
    sym,
    reference: data?.reference ?? sym.reference,
    unit: data?.unit ?? sym.unit,
    value: sym.value,
    footprint: data?.footprint !== void 0 && data.footprint !== "" ? data.footprint : sym.footprint,
    dnp: sym.dnp || inst.dnp,
    excludeFromSim: sym.excludeFromSim || inst.excludeFromSim,
    onBoard: sym.onBoard && inst.onBoard
  };
  if (sym.valueSpan) out.valueSpan = { file: inst.sheet.file, ...sym.valueSpan };
  if (data?.value !== void 0 && data.value !== "" && data !== sym.defaultInstance) {
    out.value = data.value;
    if (data.valueSpan) out.valueSpan = { file: dataFile, ...data.valueSpan };
  }
  return out;
}

// src/read/kicad-sch/buses.ts
var MAX_BUS_MEMBERS = 4096;
var VECTOR = /^(.*?)\[(\d+)\.\.(\d+)\]$/;
var GROUP = /^([^{}\s]*)\{(.+)\}$/;
function parseBusName(text, aliases, depth = 0) {
  const v = VECTOR.exec(text);
  if (v) {
    const prefix = v[1] ?? "";
    let a = Number(v[2]);
    let b = Number(v[3]);
    if (a === b) return void 0;
    if (a > b) {
      const t = a;
      a = b;
      b = t;
    }
    if (b - a + 1 > MAX_BUS_MEMBERS || prefix.includes("[")) return void 0;
    const members = [];
    for (let i = a; i <= b; i++) members.push(prefix + String(i));
    return { kind: "vector", members };
  }
  const g = GROUP.exec(text);
  if (g && depth < 4) {
    const name = g[1] ?? "";
    const members = [];
    for (const part of (g[2] ?? "").split(/[\s,]+/).filter((s) => s !== "")) {
      const inner = parseBusName(part, aliases, depth + 1);
      const names = inner ? inner.members : [part];
      for (const m of names) members.push(name === "" ? m : `${name}.${m}`);
      if (members.length > MAX_BUS_MEMBERS) return void 0;
    }
    return members.length > 0 ? { kind: "group", members } : void 0;
  }
  const alias = aliases.get(text);
  if (alias && depth < 4) {
    const members = [];
    for (const m of alias) {
      const inner = parseBusName(m, aliases, depth + 1);
      members.push(...inner ? inner.members : [m]);
    }
    return members.length > 0 && members.length <= MAX_BUS_MEMBERS ? { kind: "group", members } : void 0;
  }
  return void 0;
}

// src/read/kicad-sch/segment-index.ts
var MAX_FREE_ANGLE_SEGMENTS = 2e3;
var SegmentIndex = class {
  families = [/* @__PURE__ */ new Map(), /* @__PURE__ */ new Map(), /* @__PURE__ */ new Map(), /* @__PURE__ */ new Map()];
  general = [];
  /** Free-angle segments left out of interior checks (over MAX_FREE_ANGLE_SEGMENTS). */
  overflow = 0;
  /**
   * @param segs flat [x1, y1, x2, y2, …]; segment i gets id `i`.
   * @param onMerge called for each pair of collinear segments that overlap or touch.
   */
  constructor(segs, onMerge) {
    const raw = [/* @__PURE__ */ new Map(), /* @__PURE__ */ new Map(), /* @__PURE__ */ new Map(), /* @__PURE__ */ new Map()];
    const n = segs.length >> 2;
    for (let i = 0; i < n; i++) {
      const x1 = segs[4 * i] ?? 0, y1 = segs[4 * i + 1] ?? 0, x2 = segs[4 * i + 2] ?? 0, y2 = segs[4 * i + 3] ?? 0;
      const dx = x2 - x1, dy = y2 - y1;
      let family, key, lo, hi;
      if (dy === 0) {
        family = 0;
        key = y1;
        lo = Math.min(x1, x2);
        hi = Math.max(x1, x2);
      } else if (dx === 0) {
        family = 1;
        key = x1;
        lo = Math.min(y1, y2);
        hi = Math.max(y1, y2);
      } else if (dx === dy) {
        family = 2;
        key = x1 - y1;
        lo = Math.min(x1, x2);
        hi = Math.max(x1, x2);
      } else if (dx === -dy) {
        family = 3;
        key = x1 + y1;
        lo = Math.min(x1, x2);
        hi = Math.max(x1, x2);
      } else {
        if (this.general.length / 5 < MAX_FREE_ANGLE_SEGMENTS) this.general.push(x1, y1, x2, y2, i);
        else this.overflow++;
        continue;
      }
      const fam = raw[family];
      let list2 = fam.get(key);
      if (!list2) {
        list2 = [];
        fam.set(key, list2);
      }
      list2.push(lo, hi, i);
    }
    for (let f = 0; f < 4; f++) {
      const out = this.families[f];
      for (const [key, list2] of raw[f]) out.set(key, mergeRow(list2, onMerge));
    }
  }
  /** Calls `visit` once per merged interval (by one representative id) that contains the point.
   * Axis and 45° lines match exactly on the grid; other slopes within one grid unit. */
  forEachAt(x, y, visit) {
    probe(this.families[0]?.get(y), x, visit);
    probe(this.families[1]?.get(x), y, visit);
    probe(this.families[2]?.get(x - y), x, visit);
    probe(this.families[3]?.get(x + y), x, visit);
    const g = this.general;
    for (let k = 0; k < g.length; k += 5) {
      const x1 = g[k] ?? 0, y1 = g[k + 1] ?? 0, x2 = g[k + 2] ?? 0, y2 = g[k + 3] ?? 0;
      if (x < Math.min(x1, x2) - 1 || x > Math.max(x1, x2) + 1 || y < Math.min(y1, y2) - 1 || y > Math.max(y1, y2) + 1) continue;
      const dx = x2 - x1, dy = y2 - y1;
      const cross = (x - x1) * dy - (y - y1) * dx;
      if (cross * cross <= dx * dx + dy * dy) visit(g[k + 4] ?? 0);
    }
  }
};
function mergeRow(list2, onMerge) {
  const count = list2.length / 3;
  const order = Array.from({ length: count }, (_, i) => i);
  order.sort((a, b) => (list2[3 * a] ?? 0) - (list2[3 * b] ?? 0));
  const row = { starts: [], ends: [], reps: [] };
  let curStart = 0, curEnd = 0, curRep = -1;
  for (const i of order) {
    const lo = list2[3 * i] ?? 0, hi = list2[3 * i + 1] ?? 0, id = list2[3 * i + 2] ?? 0;
    if (curRep >= 0 && lo <= curEnd) {
      onMerge(curRep, id);
      if (hi > curEnd) curEnd = hi;
      continue;
    }
    if (curRep >= 0) {
      row.starts.push(curStart);
      row.ends.push(curEnd);
      row.reps.push(curRep);
    }
    curStart = lo;
    curEnd = hi;
    curRep = id;
  }
  if (curRep >= 0) {
    row.starts.push(curStart);
    row.ends.push(curEnd);
    row.reps.push(curRep);
  }
  return row;
}
function probe(row, t, visit) {
  if (!row) return;
  const { starts, ends, reps } = row;
  let lo = 0, hi = starts.length - 1, found = -1;
  while (lo <= hi) {
    const mid = lo + hi >> 1;
    if ((starts[mid] ?? 0) <= t) {
      found = mid;
      lo = mid + 1;
    } else hi = mid - 1;
  }
  if (found >= 0 && (ends[found] ?? 0) >= t) visit(reps[found] ?? 0);
}

// src/read/kicad-sch/union-find.ts
var UnionFind = class {
  parent;
  size;
  count = 0;
  constructor(capacity = 1024) {
    this.parent = new Int32Array(Math.max(16, capacity));
    this.size = new Int32Array(Math.max(16, capacity));
  }
  /** Adds a singleton set and returns its id. */
  add() {
    if (this.count === this.parent.length) this.grow();
    const id = this.count++;
    this.parent[id] = id;
    this.size[id] = 1;
    return id;
  }
  get length() {
    return this.count;
  }
  find(id) {
    const parent = this.parent;
    let x = id;
    while (parent[x] !== x) {
      const p = parent[x] ?? x;
      const gp = parent[p] ?? p;
      parent[x] = gp;
      x = gp;
    }
    return x;
  }
  union(a, b) {
    let ra = this.find(a);
    let rb = this.find(b);
    if (ra === rb) return ra;
    if ((this.size[ra] ?? 0) < (this.size[rb] ?? 0)) {
      const t = ra;
      ra = rb;
      rb = t;
    }
    this.parent[rb] = ra;
    this.size[ra] = (this.size[ra] ?? 0) + (this.size[rb] ?? 0);
    return ra;
  }
  grow() {
    const n = this.parent.length * 2;
    const p = new Int32Array(n);
    p.set(this.parent);
    const s = new Int32Array(n);
    s.set(this.size);
    this.parent = p;
    this.size = s;
  }
};

// src/read/kicad-sch/local-graph.ts
var cache = /* @__PURE__ */ new WeakMap();
function localGraphOf(sheet) {
  let g = cache.get(sheet);
  if (!g) {
    g = buildLocalGraph(sheet);
    cache.set(sheet, g);
  }
  return g;
}
function buildLocalGraph(sheet) {
  const uf = new UnionFind(1024);
  const segs = sheet.wires.concat(sheet.busEntries);
  const segCount = segs.length >> 2;
  for (let i = 0; i < segCount; i++) uf.add();
  const index = new SegmentIndex(segs, (a, b) => {
    uf.union(a, b);
  });
  if (index.overflow > 0) {
    sheet.notes.push({
      file: sheet.file,
      line: 0,
      column: 0,
      message: `${index.overflow} wires at angles other than 0/45/90\xB0 beyond the first ${MAX_FREE_ANGLE_SEGMENTS} connect only at their ends (labels and junctions on their interior are not checked)`
    });
  }
  const points = /* @__PURE__ */ new Map();
  const attach = (id, x, y) => {
    const key = pointKey(x, y);
    const other = points.get(key);
    if (other === void 0) points.set(key, id);
    else uf.union(id, other);
  };
  const attachThrough = (id, x, y) => {
    index.forEachAt(x, y, (seg) => {
      uf.union(id, seg);
    });
  };
  for (let i = 0; i < segCount; i++) {
    attach(i, segs[4 * i] ?? 0, segs[4 * i + 1] ?? 0);
    attach(i, segs[4 * i + 2] ?? 0, segs[4 * i + 3] ?? 0);
  }
  for (let i = sheet.wires.length >> 2; i < segCount; i++) {
    attachThrough(i, segs[4 * i] ?? 0, segs[4 * i + 1] ?? 0);
    attachThrough(i, segs[4 * i + 2] ?? 0, segs[4 * i + 3] ?? 0);
  }
  const junctionIds = [];
  for (let k = 0; k < sheet.junctions.length; k += 2) {
    const id = uf.add();
    const x = sheet.junctions[k] ?? 0, y = sheet.junctions[k + 1] ?? 0;
    attach(id, x, y);
    attachThrough(id, x, y);
    junctionIds.push(id);
  }
  const ncIds = [];
  for (let k = 0; k < sheet.noConnects.length; k += 2) {
    const id = uf.add();
    attach(id, sheet.noConnects[k] ?? 0, sheet.noConnects[k + 1] ?? 0);
    ncIds.push(id);
  }
  const labelBus = sheet.labels.map((l) => parseBusName(l.text, sheet.busAliases));
  const labelIds = sheet.labels.map((l, i) => {
    if (labelBus[i]) return -1;
    const id = uf.add();
    attach(id, l.x, l.y);
    attachThrough(id, l.x, l.y);
    return id;
  });
  const sheetPinBus = sheet.sheets.map((s) => s.pins.map((p) => parseBusName(p.name, sheet.busAliases)));
  const sheetPinIds = sheet.sheets.map((s, si3) => s.pins.map((p, pi) => {
    if (sheetPinBus[si3]?.[pi]) return -1;
    const id = uf.add();
    attach(id, p.x, p.y);
    return id;
  }));
  const classOfRoot = /* @__PURE__ */ new Map();
  const classOf = (id) => {
    const r = uf.find(id);
    let c = classOfRoot.get(r);
    if (c === void 0) {
      c = classOfRoot.size;
      classOfRoot.set(r, c);
    }
    return c;
  };
  const pointClass = /* @__PURE__ */ new Map();
  for (const [key, id] of points) pointClass.set(key, classOf(id));
  const labelClass = Int32Array.from(labelIds, (id) => id < 0 ? -1 : classOf(id));
  const sheetPinClass = sheetPinIds.map((ids) => Int32Array.from(ids, (id) => id < 0 ? -1 : classOf(id)));
  for (const id of junctionIds) classOf(id);
  const ncClasses = ncIds.map(classOf);
  const classCount = classOfRoot.size;
  const noConnect = new Uint8Array(classCount);
  for (const c of ncClasses) noConnect[c] = 1;
  const bus = buildBusLayer(sheet, labelBus, sheetPinBus);
  const hierarchicalTexts = /* @__PURE__ */ new Set();
  for (const l of sheet.labels) if (l.kind === "hierarchical") hierarchicalTexts.add(l.text);
  return {
    classCount,
    pointClass,
    labelClass,
    sheetPinClass,
    noConnect,
    busClassOfLabel: bus.ofLabel,
    busClassOfSheetPin: bus.ofSheetPin,
    busClassCount: bus.count,
    labelBus,
    sheetPinBus,
    hierarchicalTexts
  };
}
function buildBusLayer(sheet, labelBus, sheetPinBus) {
  const uf = new UnionFind(64);
  const segCount = sheet.buses.length >> 2;
  for (let i = 0; i < segCount; i++) uf.add();
  const index = new SegmentIndex(sheet.buses, (a, b) => {
    uf.union(a, b);
  });
  const points = /* @__PURE__ */ new Map();
  const attach = (id, x, y, through) => {
    const key = pointKey(x, y);
    const other = points.get(key);
    if (other === void 0) points.set(key, id);
    else uf.union(id, other);
    if (through) index.forEachAt(x, y, (seg) => {
      uf.union(id, seg);
    });
  };
  for (let i = 0; i < segCount; i++) {
    attach(i, sheet.buses[4 * i] ?? 0, sheet.buses[4 * i + 1] ?? 0, false);
    attach(i, sheet.buses[4 * i + 2] ?? 0, sheet.buses[4 * i + 3] ?? 0, false);
  }
  for (let k = 0; k < sheet.junctions.length; k += 2) {
    attach(uf.add(), sheet.junctions[k] ?? 0, sheet.junctions[k + 1] ?? 0, true);
  }
  const labelIds = sheet.labels.map((l, i) => labelBus[i] ? ((id) => {
    attach(id, l.x, l.y, true);
    return id;
  })(uf.add()) : -1);
  const pinIds = sheet.sheets.map((s, si3) => s.pins.map((p, pi) => sheetPinBus[si3]?.[pi] ? ((id) => {
    attach(id, p.x, p.y, false);
    return id;
  })(uf.add()) : -1));
  const classOfRoot = /* @__PURE__ */ new Map();
  const classOf = (id) => {
    if (id < 0) return -1;
    const r = uf.find(id);
    let c = classOfRoot.get(r);
    if (c === void 0) {
      c = classOfRoot.size;
      classOfRoot.set(r, c);
    }
    return c;
  };
  return {
    ofLabel: Int32Array.from(labelIds, classOf),
    ofSheetPin: pinIds.map((ids) => Int32Array.from(ids, classOf)),
    count: classOfRoot.size
  };
}

// src/read/kicad-sch/design-graph.ts
var MAX_BUS_MEMBERS_PER_DESIGN = 1e6;
var FLAG_NO_CONNECT = 1;
var FLAG_POWER = 2;
var FLAG_GROUND = 4;
function buildDesignGraph(instances, root) {
  const uf = new UnionFind(4096);
  const flagList = [];
  const add = (flag = 0) => {
    flagList.push(flag);
    return uf.add();
  };
  const nameNodes = /* @__PURE__ */ new Map();
  const nameNode = (space, text) => {
    const key = `${space}\0${text}`;
    let n = nameNodes.get(key);
    if (n === void 0) {
      n = add();
      nameNodes.set(key, n);
    }
    return n;
  };
  const drivers = [];
  const parts = [];
  const notes = [];
  const missingLib = /* @__PURE__ */ new Set();
  const unannotatedCount = /* @__PURE__ */ new Map();
  const bases = [];
  const notedPins = /* @__PURE__ */ new Set();
  let busBudget = MAX_BUS_MEMBERS_PER_DESIGN;
  let busBudgetNoted = false;
  const spendBus = (bus, file, line, column) => {
    if (bus.members.length <= busBudget) {
      busBudget -= bus.members.length;
      return true;
    }
    if (!busBudgetNoted) {
      busBudgetNoted = true;
      notes.push({ file, line, column, message: `more than ${MAX_BUS_MEMBERS_PER_DESIGN} bus members in the design; this and later bus names are not expanded` });
    }
    return false;
  };
  for (const inst of instances) {
    const sheet = inst.sheet;
    const g = localGraphOf(sheet);
    const local = `L${inst.index}`;
    const base = uf.length;
    bases[inst.index] = base;
    for (let c = 0; c < g.classCount; c++) add(g.noConnect[c] ? FLAG_NO_CONNECT : 0);
    sheet.labels.forEach((label, i) => {
      const cls = g.labelClass[i] ?? -1;
      if (cls < 0) return;
      const node = base + cls;
      const global = label.kind === "global";
      uf.union(node, nameNode(global ? "G" : local, label.text));
      drivers.push({
        node,
        priority: global ? PRIORITY.globalLabel : label.kind === "local" ? PRIORITY.localLabel : PRIORITY.hierarchicalLabel,
        depth: inst.depth,
        rank: 0,
        name: global ? escapeNetText(label.text) : inst.namePath + escapeNetText(label.text),
        alias: true
      });
    });
    const pinPoints = /* @__PURE__ */ new Map();
    for (const sym of sheet.symbols) {
      const resolved = resolveSymbol(sym, inst, root);
      const lib = sheet.lib.get(sym.libKey);
      if (!lib) {
        const key = `${sheet.file}\0${sym.libKey}`;
        if (!missingLib.has(key)) {
          missingLib.add(key);
          notes.push({
            file: sheet.file,
            line: sym.line,
            column: sym.column,
            ref: resolved.reference,
            message: `symbol ${resolved.reference} uses library symbol "${sym.libKey}", which is not embedded in the file; its pins are unknown`
          });
        }
        continue;
      }
      const isPowerSymbol = lib.power !== void 0;
      const isPart = !isPowerSymbol && !resolved.reference.startsWith("#");
      let part;
      if (isPart) {
        let ref = resolved.reference;
        const annotated = ref !== "" && !ref.endsWith("?");
        if (!annotated) {
          const stem = ref === "" ? "?" : ref;
          const k = (unannotatedCount.get(stem) ?? 0) + 1;
          unannotatedCount.set(stem, k);
          ref = `${stem}${k}`;
          notes.push({
            file: sheet.file,
            line: sym.line,
            column: sym.column,
            ref,
            message: `symbol ${stem} is not annotated; listed as ${ref} \u2014 annotate the schematic so references are stable`
          });
        }
        part = { ref, annotated, resolved, lib, inst, pins: [] };
        parts.push(part);
      }
      const groundSymbol = isPowerSymbol && (isGroundName(lib.id) || isGroundName(resolved.value));
      for (const lp of lib.pins) {
        if (lp.unit !== 0 && lp.unit !== resolved.unit) continue;
        if (lp.style !== 0 && lp.style !== sym.bodyStyle) continue;
        const altName = sym.alternates.get(lp.number);
        const altType = altName !== void 0 ? lp.alternates.get(altName) : void 0;
        const name = altType !== void 0 && altName !== void 0 ? altName : lp.name;
        const type = altType ?? lp.type;
        const [dx, dy] = pinOffset(lp.x, lp.y, sym.angle, sym.mirror);
        const key = pointKey(sym.x + dx, sym.y + dy);
        let flag = type === "no_connect" ? FLAG_NO_CONNECT : 0;
        if (isPowerSymbol) flag |= FLAG_POWER | (groundSymbol ? FLAG_GROUND : 0);
        const node = add(flag);
        const cls = g.pointClass.get(key);
        if (cls !== void 0) uf.union(node, base + cls);
        else {
          const other = pinPoints.get(key);
          if (other === void 0) pinPoints.set(key, node);
          else uf.union(node, other);
        }
        if (isPowerSymbol) {
          if (type !== "power_in") continue;
          const netName = sheet.version >= POWER_NAME_FROM_VALUE ? resolved.value !== "" ? resolved.value : name : name !== "" ? name : resolved.value;
          if (netName === "") continue;
          const localPower = lib.power === "local";
          uf.union(node, nameNode(localPower ? `P${inst.index}` : "G", netName));
          drivers.push({
            node,
            priority: PRIORITY.powerPin,
            depth: inst.depth,
            rank: localPower ? 1 : 2,
            name: localPower ? inst.namePath + escapeNetText(netName) : escapeNetText(netName),
            alias: true
          });
          continue;
        }
        if (type === "power_in" && lp.hidden && name !== "") {
          flagList[node] = (flagList[node] ?? 0) | FLAG_POWER;
          uf.union(node, nameNode("G", name));
          drivers.push({ node, priority: PRIORITY.powerPin, depth: inst.depth, rank: 2, name: escapeNetText(name), alias: true });
        }
        if (part) {
          const nameRepeats = name !== "" && (pinNameCounts(lib, resolved.unit, sym.bodyStyle).get(name) ?? 0) > 1;
          part.pins.push({ node, part, number: lp.number, name, type, nameRepeats });
        }
      }
    }
    const busItems = /* @__PURE__ */ new Map();
    sheet.labels.forEach((label, i) => {
      const bus = g.labelBus[i];
      const cls = g.busClassOfLabel[i] ?? -1;
      if (!bus || cls < 0 || !spendBus(bus, sheet.file, label.line, label.column)) return;
      const global = label.kind === "global";
      pushBus(busItems, cls, {
        bus,
        space: global ? "G" : local,
        depth: inst.depth,
        rank: 0,
        prefix: global ? "" : inst.namePath,
        alias: true,
        priority: global ? PRIORITY.globalLabel : label.kind === "local" ? PRIORITY.localLabel : PRIORITY.hierarchicalLabel
      });
    });
    sheet.sheets.forEach((ref, si3) => {
      const child = instances[inst.children[si3] ?? -1];
      if (!child) return;
      const childGraph = localGraphOf(child.sheet);
      const childSpace = `L${child.index}`;
      ref.pins.forEach((pin, pi) => {
        const reaches = childGraph.hierarchicalTexts.has(pin.name);
        const noteKey = `${sheet.file}\0${pin.line}\0${pin.column}`;
        if (!reaches && !notedPins.has(noteKey)) {
          notedPins.add(noteKey);
          notes.push({
            file: sheet.file,
            line: pin.line,
            column: pin.column,
            message: `sheet pin "${pin.name}" of sheet "${ref.name}" has no hierarchical label of that name in ${child.sheet.file}; it connects nothing inside`
          });
        }
        const bus = g.sheetPinBus[si3]?.[pi];
        if (bus) {
          if (!spendBus(bus, sheet.file, pin.line, pin.column)) return;
          const cls2 = g.busClassOfSheetPin[si3]?.[pi] ?? -1;
          if (cls2 >= 0) {
            pushBus(busItems, cls2, {
              bus,
              space: local,
              priority: PRIORITY.sheetPin,
              depth: inst.depth,
              rank: pin.shape === "output" ? 1 : 0,
              prefix: inst.namePath,
              alias: false
            });
          }
          if (reaches) for (const m of bus.members) uf.union(nameNode(local, m), nameNode(childSpace, m));
          return;
        }
        const cls = g.sheetPinClass[si3]?.[pi] ?? -1;
        if (cls < 0) return;
        const node = base + cls;
        drivers.push({
          node,
          priority: PRIORITY.sheetPin,
          depth: inst.depth,
          rank: pin.shape === "output" ? 1 : 0,
          name: inst.namePath + escapeNetText(pin.name),
          alias: false
        });
        if (reaches) uf.union(node, nameNode(childSpace, pin.name));
      });
    });
    for (const items of busItems.values()) {
      for (const item of items) {
        for (const m of item.bus.members) {
          drivers.push({
            node: nameNode(item.space, m),
            priority: item.priority,
            depth: item.depth,
            rank: item.rank,
            name: item.prefix + escapeNetText(m),
            alias: item.alias
          });
        }
      }
      const vectors = items.filter((it) => it.bus.kind === "vector");
      const first = vectors[0];
      if (first) {
        for (const other of vectors.slice(1)) {
          const n = Math.min(first.bus.members.length, other.bus.members.length);
          for (let k = 0; k < n; k++) {
            uf.union(nameNode(first.space, first.bus.members[k] ?? ""), nameNode(other.space, other.bus.members[k] ?? ""));
          }
        }
      }
      const byMember = /* @__PURE__ */ new Map();
      for (const item of items) {
        if (item.bus.kind !== "group") continue;
        for (const m of item.bus.members) {
          const node = nameNode(item.space, m);
          const seen = byMember.get(m);
          if (seen === void 0) byMember.set(m, node);
          else uf.union(seen, node);
        }
      }
    }
  }
  return { uf, flags: Uint8Array.from(flagList), parts, drivers, notes };
}
var nameCountCache = /* @__PURE__ */ new WeakMap();
function pinNameCounts(lib, unit, style) {
  let perUnit = nameCountCache.get(lib);
  if (!perUnit) {
    perUnit = /* @__PURE__ */ new Map();
    nameCountCache.set(lib, perUnit);
  }
  const key = `${unit}/${style}`;
  let counts = perUnit.get(key);
  if (!counts) {
    counts = /* @__PURE__ */ new Map();
    for (const p of lib.pins) {
      if ((p.unit === 0 || p.unit === unit) && (p.style === 0 || p.style === style) && p.name !== "") {
        counts.set(p.name, (counts.get(p.name) ?? 0) + 1);
      }
    }
    perUnit.set(key, counts);
  }
  return counts;
}
function pushBus(map, cls, item) {
  const list2 = map.get(cls);
  if (list2) list2.push(item);
  else map.set(cls, [item]);
}

// src/read/kicad-sch/assemble.ts
function assemble(graph, version) {
  const { uf } = graph;
  const notes = [];
  const classes = /* @__PURE__ */ new Map();
  for (const part of graph.parts) {
    if (!part.resolved.onBoard) continue;
    for (const pin of part.pins) {
      const root = uf.find(pin.node);
      let c = classes.get(root);
      if (!c) {
        c = { members: [], drivers: [], flags: 0 };
        classes.set(root, c);
      }
      c.members.push(pin);
    }
  }
  const flags = graph.flags;
  for (let node = 0; node < flags.length; node++) {
    const f = flags[node] ?? 0;
    if (f === 0) continue;
    const c = classes.get(uf.find(node));
    if (c) c.flags |= f;
  }
  for (const d of graph.drivers) classes.get(uf.find(d.node))?.drivers.push(d);
  const byName = /* @__PURE__ */ new Map();
  for (const c of classes.values()) {
    const name = chooseName(c, version);
    const list2 = byName.get(name);
    if (list2) list2.push(c);
    else byName.set(name, [c]);
  }
  const nets = [];
  const netOfPin = /* @__PURE__ */ new Map();
  const displayTaken = /* @__PURE__ */ new Set();
  for (const [escaped, group] of byName) {
    let display = unescapeKicad(escaped);
    if (displayTaken.has(display)) display = escaped;
    displayTaken.add(display);
    const pins = [];
    const seen = /* @__PURE__ */ new Set();
    const aliases = /* @__PURE__ */ new Set([display]);
    let f = 0;
    for (const c of group) {
      f |= c.flags;
      for (const d of c.drivers) if (d.alias) aliases.add(unescapeKicad(d.name));
      for (const p of c.members) {
        netOfPin.set(p, display);
        const key = `${p.part.ref}\0${p.number}`;
        if (seen.has(key)) continue;
        seen.add(key);
        pins.push({ ref: p.part.ref, pin: p.number });
      }
    }
    const globalNames = [...aliases].filter((a) => !a.includes("/"));
    nets.push({
      name: display,
      aliases: [...aliases].sort(),
      pins,
      isGround: (f & FLAG_GROUND) !== 0 || globalNames.some(isGroundName),
      isPower: (f & FLAG_POWER) !== 0,
      noConnect: (f & FLAG_NO_CONNECT) !== 0
    });
  }
  const parts = mergeParts(graph.parts, netOfPin, notes);
  sortCircuit(parts, nets);
  return { parts, nets, notes };
}
function chooseName(c, version) {
  let best;
  for (const d of c.drivers) if (!best || compareDrivers(d, best, version) < 0) best = d;
  if (best) return best.name;
  const noConnect = (c.flags & FLAG_NO_CONNECT) !== 0;
  const candidates3 = [];
  for (const p of c.members) {
    const annotated = p.part.annotated;
    const ref = annotated ? p.part.ref : p.part.resolved.sym.uuid || p.part.ref;
    const refWithUnit = p.part.lib.unitCount > 1 && annotated ? ref + unitLetters(p.part.resolved.unit) : ref;
    candidates3.push({
      node: p.node,
      priority: annotated ? PRIORITY.pin : 0,
      depth: p.part.inst.depth,
      rank: 0,
      alias: false,
      name: defaultNetName({ ref, refWithUnit, number: p.number, name: p.name, nameRepeats: p.nameRepeats }, noConnect, version)
    });
  }
  for (const d of candidates3) d.depth = 0;
  let bestPin;
  for (const d of candidates3) if (!bestPin || compareDrivers(d, bestPin, version) < 0) bestPin = d;
  return bestPin?.name ?? "Net-(unnamed)";
}
function mergeParts(records, netOfPin, notes) {
  const byRef2 = /* @__PURE__ */ new Map();
  for (const r of records) {
    if (!r.resolved.onBoard) continue;
    const list2 = byRef2.get(r.ref);
    if (list2) list2.push(r);
    else byRef2.set(r.ref, [r]);
  }
  const parts = [];
  for (const [ref, units] of byRef2) {
    units.sort((a, b) => a.resolved.unit - b.resolved.unit);
    const seenUnits = /* @__PURE__ */ new Set();
    for (const u of units) {
      if (seenUnits.has(u.resolved.unit)) {
        notes.push({
          file: u.inst.sheet.file,
          line: u.resolved.sym.line,
          column: u.resolved.sym.column,
          ref,
          message: `reference ${ref} (unit ${u.resolved.unit}) is placed more than once; the copies are merged \u2014 re-annotate the schematic`
        });
      }
      seenUnits.add(u.resolved.unit);
    }
    const first = units[0];
    const fields = {};
    for (const u of units) {
      for (const [k, v] of Object.entries(u.resolved.sym.fields)) if (fields[k] === void 0 || fields[k] === "" && v !== "") fields[k] = v;
    }
    const pins = {};
    const pinNames = {};
    const pinTypes = {};
    for (const u of units) {
      for (const p of u.pins) {
        const net = netOfPin.get(p);
        if (net === void 0) continue;
        const earlier = pins[p.number];
        if (earlier === void 0) {
          pins[p.number] = net;
          pinNames[p.number] = p.name;
          pinTypes[p.number] = p.type;
        } else if (earlier !== net) {
          notes.push({
            file: u.inst.sheet.file,
            line: u.resolved.sym.line,
            column: u.resolved.sym.column,
            ref,
            message: `pin ${p.number} of ${ref} is drawn more than once and touches two nets (${earlier}, ${net}); the first is kept`
          });
        }
      }
    }
    const value = units.find((u) => u.resolved.value !== "")?.resolved ?? first.resolved;
    const input = {
      ref,
      value: value.value,
      libId: first.resolved.sym.libId,
      footprint: units.find((u) => u.resolved.footprint !== "")?.resolved.footprint ?? "",
      pins,
      pinNames,
      pinTypes,
      fields,
      dnp: units.some((u) => u.resolved.dnp),
      excludedFromSim: units.some((u) => u.resolved.excludeFromSim),
      origin: { file: first.inst.sheet.file, line: first.resolved.sym.line, column: first.resolved.sym.column, sheetPath: first.inst.namePath }
    };
    parts.push(buildPart(value.valueSpan ? { ...input, valueSpan: value.valueSpan } : input));
  }
  return parts;
}

// src/read/kicad-sch/read-schematic.ts
function readSchematic(file, opts) {
  const { fs } = opts;
  const rootResult = opts.root ?? loadSheet(fs, file);
  if (!rootResult.ok) return rootResult;
  const root = rootResult.sheet;
  const projectRoot = opts.projectRoot ?? dirname2(file);
  const projectReal = fs.realpath(projectRoot);
  if (typeof projectReal !== "string") return wholeFileError(file, `cannot open the project folder ${projectRoot}: ${projectReal.error}`);
  if (!isInside(projectReal, rootResult.real)) return wholeFileError(file, `the schematic lies outside the project folder ${projectRoot}`);
  const hierarchy = buildHierarchy(fs, root, rootResult.real, projectReal);
  if (!hierarchy.ok) return hierarchy;
  const graph = buildDesignGraph(hierarchy.instances, root);
  const { parts, nets, notes: assembleNotes } = assemble(graph, root.version);
  const notes = [];
  const noted = /* @__PURE__ */ new Set();
  for (const inst of hierarchy.instances) {
    if (noted.has(inst.sheet.file)) continue;
    noted.add(inst.sheet.file);
    notes.push(...inst.sheet.notes);
  }
  notes.push(...graph.notes, ...assembleNotes);
  const modelLibraries = loadModelLibraries(parts, fs, projectRoot, notes);
  const circuit = {
    file,
    format: "kicad_sch",
    version: String(root.version),
    parts,
    nets,
    sheets: hierarchy.instances.map((i) => ({ path: i.namePath, file: i.sheet.file })),
    notes,
    modelLibraries
  };
  return { ok: true, circuit };
}

// src/read/index.ts
function readDesign(path, opts = {}) {
  const fs = opts.fs ?? nodeFileSource();
  try {
    const opened = openRoot(fs, path, opts.projectRoot ?? dirname3(path));
    if (opened.kind === "done") return opened.result;
    return readSchematic(path, opts.projectRoot !== void 0 ? { fs, root: opened.root, projectRoot: opts.projectRoot } : { fs, root: opened.root });
  } catch (err) {
    if (err instanceof RangeError) return wholeFileError(path, `the design is too large or too deeply nested to read (${err.message})`);
    throw err;
  }
}
function openRoot(fs, path, projectRoot) {
  const loaded = loadTree(fs, path);
  if (!loaded.ok) return { kind: "done", result: loaded };
  const first = loaded.tree.nodes[0];
  const kw = keywordOf(first);
  if (kw === "kicad_sch") return { kind: "schematic", root: sheetFromTree(fs, loaded.tree, path, loaded.real) };
  if (kw === "export") return { kind: "done", result: readNetlistTree(loaded.tree, path, fs, projectRoot) };
  const p = first ? where(first) : { line: 1, column: 1 };
  const legacy = textOf(first) === "EESchema" ? " (a KiCad 5 schematic: open and save it in KiCad 6 or later, or export a netlist)" : "";
  return { kind: "done", result: { ok: false, error: {
    file: path,
    line: p.line,
    column: p.column,
    message: `not a KiCad schematic or netlist: expected "(kicad_sch" or "(export" at the start, found ${describeFirstForm(loaded.tree.nodes)}${legacy}`
  } } };
}
function findRootSheets(paths, fs = nodeFileSource()) {
  const errors = [];
  const given = [];
  for (const path of paths) {
    try {
      const loaded = loadTree(fs, path);
      if (!loaded.ok) {
        errors.push(loaded.error);
        continue;
      }
      const kw = keywordOf(loaded.tree.nodes[0]);
      if (kw === "kicad_sch") {
        const s = sheetFromTree(fs, loaded.tree, path, loaded.real);
        if (!s.ok) {
          errors.push(s.error);
          continue;
        }
      }
      given.push({ path, real: loaded.real });
    } catch (err) {
      if (err instanceof RangeError) {
        errors.push({ file: path, line: 0, column: 0, message: "the file is too deeply nested to read" });
        continue;
      }
      throw err;
    }
  }
  const reach = /* @__PURE__ */ new Map();
  for (const g of given) reach.set(g.real, reachableSheets(fs, g.path));
  const roots = given.filter((x) => !given.some((y) => y.real !== x.real && (reach.get(y.real)?.has(x.real) ?? false) && !(reach.get(x.real)?.has(y.real) ?? false)));
  const seen = /* @__PURE__ */ new Set();
  return { roots: roots.filter((r) => seen.has(r.real) ? false : (seen.add(r.real), true)).map((r) => r.path), errors };
}
function reachableSheets(fs, path) {
  const out = /* @__PURE__ */ new Set();
  const queue = [path];
  while (queue.length > 0) {
    const file = queue.shift();
    const s = loadSheet(fs, file);
    if (!s.ok) continue;
    for (const ref of s.sheet.sheets) {
      const child = sheetPathFor(s.sheet.file, ref.fileName);
      const real = fs.realpath(child);
      if (typeof real !== "string" || out.has(real)) continue;
      out.add(real);
      queue.push(child);
    }
  }
  return out;
}

// src/version.ts
var VERSION = "0.1.0";

// src/solve/reactance.ts
function faradsForReactance(ohms, hertz) {
  return 1 / (2 * Math.PI * hertz * ohms);
}
function faradsForSelfResonance(hertz, esl) {
  return 1 / ((2 * Math.PI * hertz) ** 2 * esl);
}
function highPassCorner(ohms, farads) {
  return 1 / (2 * Math.PI * ohms * farads);
}
function highPassLossDb(hertz, corner) {
  return 10 * Math.log10(1 + (corner / hertz) ** 2);
}

// rules/bypass-search.ts
function faradsForResonance(ctx, hertz, like) {
  const esl = ctx.capacitorLike(like, 1e-7)?.esl;
  if (esl === void 0 || !(esl > 0)) return void 0;
  return faradsForSelfResonance(hertz, esl);
}
function worstAgainst(points, limit) {
  let worst = { ratio: 0, ohms: 0, hertz: points[0]?.hertz ?? 0 };
  for (const p of points) {
    const ratio = p.magnitude / limit(p.hertz);
    if (ratio > worst.ratio) worst = { ratio, ohms: p.magnitude, hertz: p.hertz };
  }
  return worst;
}
function suggestShuntCapacitor(ctx, request, centreFarads) {
  const node = ctx.nodeOf(request.net);
  const aimFarads = centreFarads ?? faradsForResonance(ctx, request.aimHertz, request.like);
  if (node === void 0 || aimFarads === void 0) return void 0;
  const span = 10 ** (request.spanDecades ?? 1);
  let best;
  const templates = [request.like, ...request.alsoLike ?? []].filter((t, i, all) => all.indexOf(t) === i);
  let meets;
  for (const like of templates) {
    const found = searchOne(ctx, request, like, node, aimFarads, span);
    if (!found) continue;
    if (found.worstRatio <= 1 && (!meets || found.farads < meets.farads)) meets = found;
    if (!best || found.worstRatio < best.worstRatio * 0.99) best = found;
  }
  return meets ?? best;
}
function searchOne(ctx, request, like, node, aimFarads, span) {
  let best;
  for (const farads of ctx.seriesValues(request.series, aimFarads / span, aimFarads * span)) {
    const model = ctx.capacitorLike(like, farads);
    if (!model) continue;
    const extra = [{ kind: "C", name: "Csuggested", a: node, b: "0", farads, esr: model.esr, esl: model.esl }];
    const points = ctx.impedance(request.net, request.frequencies, { passiveOnly: true, extra, without: request.replaces ?? [] });
    if (!points) continue;
    const worst = worstAgainst(points, request.limit);
    const candidate = { farads, model, like, worstRatio: worst.ratio, worstOhms: worst.ohms, atHertz: worst.hertz };
    if (worst.ratio <= 1) return candidate;
    if (!best || worst.ratio < best.worstRatio * 0.99) best = candidate;
  }
  return best;
}
function refinePeak(ctx, net, lowHertz, highHertz) {
  let lo = lowHertz;
  let hi = highHertz;
  let best;
  for (let round = 0; round < 3; round++) {
    const grid = Array.from({ length: 21 }, (_, i) => lo * (hi / lo) ** (i / 20));
    const points = ctx.impedance(net, grid, { passiveOnly: true });
    if (!points) return best;
    let index = 0;
    points.forEach((p, i) => {
      if (p.magnitude > (points[index]?.magnitude ?? -1)) index = i;
    });
    best = points[index];
    lo = grid[Math.max(0, index - 1)] ?? lo;
    hi = grid[Math.min(grid.length - 1, index + 1)] ?? hi;
  }
  return best;
}

// src/circuit/units.ts
var PREFIXES = [
  [1e12, "T"],
  [1e9, "G"],
  [1e6, "M"],
  [1e3, "k"],
  [1, ""],
  [1e-3, "m"],
  [1e-6, "\xB5"],
  [1e-9, "n"],
  [1e-12, "p"],
  [1e-15, "f"]
];
function formatQuantity(value, unit, digits = 3) {
  const space = unit === "" ? "" : " ";
  if (Number.isNaN(value)) return `NaN${space}${unit}`;
  if (!Number.isFinite(value)) return `${value < 0 ? "-" : ""}\u221E${space}${unit}`;
  if (value === 0) return `0${space}${unit}`;
  const rounded = Number(value.toPrecision(digits));
  const abs = Math.abs(rounded);
  let chosen = PREFIXES[PREFIXES.length - 1] ?? [1, ""];
  for (const p of PREFIXES) {
    if (abs >= p[0] * (1 - 1e-12)) {
      chosen = p;
      break;
    }
  }
  if (abs >= 0.1 && abs < 1) chosen = [1, ""];
  const mantissa = Number((rounded / chosen[0]).toPrecision(digits));
  const text = `${mantissa}`;
  return `${text}${space}${chosen[1]}${unit}`;
}
var UNIT_WORDS = {
  Hz: { spellings: ["Hz", "hz", "HZ"], noun: "frequency", example: "1.8 MHz" },
  "\u03A9": { spellings: ["\u03A9", "\u2126", "ohms", "ohm", "Ohms", "Ohm", "OHM", "R"], noun: "resistance", example: "2.5 ohm" },
  V: { spellings: ["V", "v"], noun: "voltage", example: "50 mV" },
  A: { spellings: ["A"], noun: "current", example: "20 mA" },
  F: { spellings: ["F"], noun: "capacitance", example: "100 nF" },
  H: { spellings: ["H"], noun: "inductance", example: "10 uH" }
};
var PREFIX_OF = {
  T: 12,
  G: 9,
  M: 6,
  meg: 6,
  Meg: 6,
  MEG: 6,
  k: 3,
  K: 3,
  m: -3,
  u: -6,
  "\xB5": -6,
  "\u03BC": -6,
  n: -9,
  p: -12,
  f: -15
};
var PREFIX_KEYS = Object.keys(PREFIX_OF).sort((a, b) => b.length - a.length);
function parseQuantity(text, unit) {
  const words3 = UNIT_WORDS[unit];
  const t = text.trim();
  const fail = { error: `expected a ${words3.noun} such as '${words3.example}', got '${text}'` };
  const m = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*)$/.exec(t);
  if (!m) return fail;
  const mantissa = m[1] ?? "";
  let rest = (m[2] ?? "").trim();
  for (const sp of [...words3.spellings].sort((a, b) => b.length - a.length)) {
    if (rest.endsWith(sp)) {
      rest = rest.slice(0, rest.length - sp.length).trim();
      break;
    }
  }
  let exp = 0;
  if (rest !== "") {
    const prefix = PREFIX_KEYS.find((p) => p === rest);
    if (prefix === void 0) return fail;
    exp = PREFIX_OF[prefix] ?? 0;
  }
  const value = /e/i.test(mantissa) ? Number(mantissa) * 10 ** exp : Number(`${mantissa}e${exp}`);
  return Number.isFinite(value) ? value : fail;
}

// rules/support.ts
function finding(ctx, rule, init) {
  const origin = init.at?.origin;
  const out = {
    rule,
    severity: init.severity,
    message: init.message,
    parts: init.parts,
    nets: init.nets,
    file: origin?.file ?? ctx.circuit.file,
    line: origin?.line ?? 0,
    column: origin?.column ?? 0,
    sheetPath: origin?.sheetPath ?? "/",
    data: init.data
  };
  if (init.fix) out.fix = init.fix;
  return out;
}
var si = formatQuantity;
function bandText(ctx) {
  const { low, high, isDefault } = ctx.band;
  const range = `${si(low, "Hz")} to ${si(high, "Hz")}`;
  return isDefault ? `${range} (default band; set "band" in loadline.json)` : range;
}
function numberOption(options8, name, fallback) {
  const value = options8[name];
  return typeof value === "number" && Number.isFinite(value) ? value : fallback;
}
function byRef(a, b) {
  return a.ref.localeCompare(b.ref, "en", { numeric: true });
}

// rules/base-ac-ground.ts
var ID = "base-ac-ground";
var doc = {
  what: "For every common-base stage (the upper device of a bipolar cascode), gate 2 of every dual-gate MOSFET and the gate of every common-gate stage, sweeps |Z| from that node to ground over the band through the bias divider and its capacitors; a capacitor to a rail counts only as well as that rail is bypassed, because the whole passive network is solved. The limit is what the stage tolerates: |Zb|/(\u03B2+1) \u2264 k\xB7r_e at low frequency (r_e = V_T/I_C, \u03B2 = I_C/I_B from the operating point), falling with the device's C\u03C0 at high frequency; for a FET gate |Zg| \u2264 k/(\u03C9Cgs). Reports a missing capacitor, where grounding fails, and the value needed.",
  why: "A common-base or common-gate stage works only while its base or gate sits still. Impedance left there appears in series with the emitter's input resistance (divided by \u03B2+1 for a bipolar device) and degenerates the stage; in a cascode the lower device's collector starts to swing again and its Miller capacitance comes back, so the bandwidth the cascode exists for is lost.",
  fix: "Bypass the base (gate 2, gate) to ground with the value suggested, mounted at the pin with short leads; if it is bypassed to a rail, make sure that rail is bypassed at the same frequencies, or return the capacitor to ground instead.",
  references: [
    "Common-base input impedance r_e + Z_b/(\u03B2+1), hybrid-\u03C0 model: A. S. Sedra and K. C. Smith, Microelectronic Circuits",
    "Cascode bandwidth and the Miller effect: P. R. Gray and R. G. Meyer, Analysis and Design of Analog Integrated Circuits",
    "k = 0.1 (an order of magnitude below the stage's own input impedance) and Xc \u2264 R_Th/10 at the band's low edge: common practice"
  ],
  example: "A 9 V cascode at 1.7 mA (\u03B2 \u2248 145, r_e \u2248 15 \u03A9) tolerates about 220 \u03A9 in the upper base with k = 0.1: a 10 \xB5F base capacitor passes, 1 nF (318 \u03A9 at 0.5 MHz) fails from the band's low edge, and about 1.5 nF is needed."
};
var options = {
  k: {
    type: "number",
    default: 0.1,
    description: "How small the base (gate) impedance must be against what the stage tolerates: |Zb|/(\u03B2+1) \u2264 k\xB7r_e."
  }
};
function candidates(ctx) {
  const out = [];
  for (const stage of ctx.stages()) {
    if (stage.type === "dual-gate-mosfet") {
      const net = stage.nets.G2;
      if (net !== void 0) out.push({ ref: stage.ref, role: "G2", net, stage, what: "gate 2" });
    } else if (stage.configuration === "common-base") {
      const net = stage.nets.B;
      if (net !== void 0) out.push({ ref: stage.ref, role: "B", net, stage, what: "base" });
    } else if (stage.configuration === "common-gate") {
      const net = stage.nets.G;
      if (net !== void 0) out.push({ ref: stage.ref, role: "G", net, stage, what: "gate" });
    }
  }
  return out;
}
function tolerance(ctx, device, k) {
  if (device.kind === "bjt") {
    if (!(device.ic > 0) || !(device.ib > 0)) return void 0;
    const vt = ctx.thermalVoltage();
    const re = vt / device.ic;
    const beta = device.ic / device.ib;
    const rin = (beta + 1) * re;
    const cpi = device.cpi > 0 ? device.cpi : 0;
    return {
      limit: (f) => k / Math.hypot(1 / rin, 2 * Math.PI * f * cpi),
      basis: `k\xB7(\u03B2+1)\xB7r_e = ${k} \xD7 ${Math.round(beta + 1)} \xD7 ${si(re, "\u03A9")} = ${si(k * rin, "\u03A9")} (I_C ${si(device.ic, "A")}, \u03B2 ${beta.toFixed(0)}${cpi > 0 ? `, less at high frequency through C\u03C0 ${si(cpi, "F")}` : ""})`,
      data: { icAmps: device.ic, beta, reOhms: re, lowFrequencyLimitOhms: k * rin, cpiFarads: cpi }
    };
  }
  if (device.kind === "jfet" || device.kind === "mosfet") {
    if (!(device.cgs > 0)) return void 0;
    const cgs = device.cgs;
    return {
      limit: (f) => k / (2 * Math.PI * f * cgs),
      basis: `k/(\u03C9C_gs) with C_gs ${si(cgs, "F")}`,
      data: { cgsFarads: cgs }
    };
  }
  return void 0;
}
function inBand(ctx, points) {
  return points.filter((p) => p.hertz >= ctx.band.low * (1 - 1e-9) && p.hertz <= ctx.band.high * (1 + 1e-9));
}
function checkOne(ctx, c, k) {
  const part = c.stage.part;
  const caps = ctx.groundingCapacitors(c.net);
  const onRail = ctx.rail(c.net) !== void 0;
  const device = c.role === "G2" ? ctx.device(c.ref, "g2") : ctx.device(c.ref);
  const tol = device ? tolerance(ctx, device, k) : void 0;
  const series2 = ctx.config.series.capacitor;
  const low = ctx.band.low;
  const kind = c.stage.configuration === "unknown" ? "stage" : `${c.stage.configuration} stage`;
  if (!tol) {
    const unmodelled = ctx.unmodelled().some((u) => u.ref === c.ref);
    const why = device ? `no usable small-signal figures for ${c.ref}` : unmodelled ? `${c.ref} not modelled` : `no operating point for ${c.ref} (${ctx.operatingPointProblem() ?? "not solved"})`;
    ctx.noteLimited(ID, `${why}: the ${c.what} impedance limit could not be computed`, [c.ref]);
  }
  if (caps.length === 0 && !onRail) {
    const neededFarads2 = tol ? ctx.snapUp(faradsForReactance(tol.limit(low), low), series2) : void 0;
    return [finding(ctx, ID, {
      at: part,
      severity: "error",
      message: `${c.ref} (${kind}): its ${c.what} (net ${c.net}) has no capacitor to ground, so it is not an AC ground and the stage degenerates.${neededFarads2 !== void 0 ? ` Bypass it with at least ${si(neededFarads2, "F")} (${si(tol?.limit(low) ?? 0, "\u03A9")} allowed at ${si(low, "Hz")}: ${tol?.basis}).` : " Bypass it to ground at the pin."}`,
      parts: [c.ref],
      nets: [c.net],
      data: { capacitors: 0, ...neededFarads2 !== void 0 ? { neededFarads: neededFarads2 } : {}, ...tol?.data ?? {} }
    })];
  }
  if (!tol) return [];
  const frequencies = ctx.frequencies(40);
  const points = ctx.impedance(c.net, frequencies, { passiveOnly: true });
  if (!points) {
    ctx.noteLimited(ID, `no impedance sweep: ${ctx.solverProblem() ?? "the network could not be built"}`, [c.ref]);
    return [];
  }
  const judged = inBand(ctx, points);
  ctx.report.addBase({
    ref: c.ref,
    net: c.net,
    curve: points.map((p) => [p.hertz, p.magnitude]),
    limitOhms: Math.min(...judged.map((p) => tol.limit(p.hertz))),
    limitCurve: judged.map((p) => [p.hertz, tol.limit(p.hertz)])
  });
  const failing = judged.filter((p) => p.magnitude > tol.limit(p.hertz));
  if (failing.length === 0) return [];
  const worst = failing.reduce((a, b) => b.magnitude / tol.limit(b.hertz) > a.magnitude / tol.limit(a.hertz) ? b : a);
  const first = failing[0] ?? worst;
  const last = failing[failing.length - 1] ?? worst;
  const capacitive = first.im < 0;
  const largest = [...caps].sort((a, b) => (b.parsed.number ?? 0) - (a.parsed.number ?? 0))[0];
  const smallest = [...caps].sort((a, b) => (a.parsed.number ?? 0) - (b.parsed.number ?? 0))[0];
  const judgedHz = judged.map((p) => p.hertz);
  let suggestion;
  let neededFarads;
  if (capacitive) {
    neededFarads = faradsForReactance(tol.limit(first.hertz), first.hertz);
    suggestion = suggestShuntCapacitor(ctx, {
      net: c.net,
      frequencies: judgedHz,
      limit: tol.limit,
      aimHertz: first.hertz,
      like: largest?.ref,
      series: series2,
      spanDecades: 1,
      replaces: largest ? [largest.ref] : []
    }, ctx.snapUp(neededFarads, series2));
  } else {
    suggestion = suggestShuntCapacitor(ctx, {
      net: c.net,
      frequencies: judgedHz,
      limit: tol.limit,
      aimHertz: first.hertz,
      like: smallest?.ref,
      series: series2
    });
  }
  const range = failing.length === judged.length ? "across the whole band" : `from ${si(first.hertz, "Hz")} to ${si(last.hertz, "Hz")}`;
  const action = capacitive ? `${largest ? `fitting ${si(suggestion?.farads ?? 0, "F")} to ground instead of ${largest.ref}` : `adding ${si(suggestion?.farads ?? 0, "F")}`}` : `adding ${si(suggestion?.farads ?? 0, "F")} like ${smallest?.ref ?? "the bypass"} (self-resonant at ${si(suggestion?.model.srfHertz ?? 0, "Hz")})`;
  const advice = suggestion ? ` ${capacitive ? `About ${si(neededFarads ?? suggestion.farads, "F")} is needed; ` : ""}${action} ${suggestion.worstRatio <= 1 ? "holds the node under the limit across the band" : `brings the worst to ${si(suggestion.worstOhms, "\u03A9")} at ${si(suggestion.atHertz, "Hz")}, still over the limit`}.` : "";
  const toRails = caps.map((cap) => ({ cap, rail: Object.values(cap.pins).find((n) => n !== c.net && ctx.rail(n) !== void 0) })).filter((x) => x.rail !== void 0);
  const railNote = toRails.length > 0 ? ` ${toRails.map((x) => `${x.cap.ref} returns to ${x.rail}`).join(", ")}: the node is only as well grounded as that rail is bypassed \u2014 bypass the rail, or return the capacitor to ground.` : "";
  return [finding(ctx, ID, {
    at: largest ?? part,
    severity: "warning",
    message: `${c.ref} (${kind}): its ${c.what} (net ${c.net}) is not an AC ground ${range} within ${bandText(ctx)}: |Z| to ground is ${si(worst.magnitude, "\u03A9")} at ${si(worst.hertz, "Hz")} where the stage tolerates ${si(tol.limit(worst.hertz), "\u03A9")} (${tol.basis}).${railNote}${advice}`,
    parts: [c.ref, ...caps.map((p) => p.ref)],
    nets: [c.net],
    data: {
      worstOhms: worst.magnitude,
      atHertz: worst.hertz,
      limitOhms: tol.limit(worst.hertz),
      failsFromHertz: first.hertz,
      failsToHertz: last.hertz,
      k,
      ...tol.data,
      ...neededFarads !== void 0 ? { neededFarads } : {},
      ...suggestion ? { suggestedFarads: suggestion.farads, worstOhmsWithSuggestion: suggestion.worstOhms, worstRatioWithSuggestion: suggestion.worstRatio } : {}
    }
  })];
}
var baseAcGround = {
  id: ID,
  title: "Common-base bases and common-gate gates are AC grounds across the band",
  severity: "warning",
  doc,
  options,
  tags: ["rf", "cascode"],
  check(ctx, opts) {
    const k = numberOption(opts, "k", 0.1);
    return candidates(ctx).flatMap((c) => checkOne(ctx, c, k));
  }
};

// src/engine/context-topology.ts
var ACTIVE_KINDS = /* @__PURE__ */ new Set([
  "npn",
  "pnp",
  "njfet",
  "pjfet",
  "nmos",
  "pmos",
  "dual-gate-mosfet"
]);
var CAPACITOR_KINDS = /* @__PURE__ */ new Set(["capacitor", "polarized-capacitor"]);
var SERIES_DC_KINDS = /* @__PURE__ */ new Set(["resistor", "inductor"]);
function isActive(part) {
  return ACTIVE_KINDS.has(part.kind);
}
function isCapacitor(part) {
  return CAPACITOR_KINDS.has(part.kind);
}
function roleOfPin(part, pin) {
  for (const [role, number] of Object.entries(part.roles)) if (number === pin) return role;
  return pin;
}
function netOfRole(part, role) {
  const pin = part.roles[role];
  return pin === void 0 ? void 0 : part.pins[pin];
}
function otherNet(part, net) {
  const nets = Object.values(part.pins);
  if (nets.length !== 2) return void 0;
  const [a, b] = nets;
  if (a === net && b !== net) return b;
  if (b === net && a !== net) return a;
  return void 0;
}
function terminalsOf(kind) {
  switch (kind) {
    case "npn":
      return { top: "C", bottom: "E", control: "B", output: "C", common: "E" };
    case "pnp":
      return { top: "E", bottom: "C", control: "B", output: "C", common: "E" };
    case "njfet":
    case "nmos":
      return { top: "D", bottom: "S", control: "G", output: "D", common: "S" };
    case "dual-gate-mosfet":
      return { top: "D", bottom: "S", control: "G1", output: "D", common: "S" };
    case "pjfet":
    case "pmos":
      return { top: "S", bottom: "D", control: "G", output: "D", common: "S" };
    default:
      return void 0;
  }
}
function indexCircuit(circuit) {
  const byRef2 = /* @__PURE__ */ new Map();
  const byNet = /* @__PURE__ */ new Map();
  for (const part of circuit.parts) {
    byRef2.set(part.ref, part);
    if (part.dnp) continue;
    for (const [pin, net] of Object.entries(part.pins)) {
      const list2 = byNet.get(net) ?? [];
      list2.push({ part, pin, role: roleOfPin(part, pin) });
      byNet.set(net, list2);
    }
  }
  return {
    partsOn: (net) => byNet.get(net) ?? [],
    part: (ref) => byRef2.get(ref)
  };
}
function groundingCapacitors(net, index, test, minimumFarads = 0) {
  const found = [];
  for (const { part } of index.partsOn(net)) {
    if (!isCapacitor(part)) continue;
    const other = otherNet(part, net);
    if (other === void 0 || !test.isSupply(other)) continue;
    const farads = part.parsed.number;
    if (farads !== void 0 && farads < minimumFarads) continue;
    const tank = index.partsOn(net).some(({ part: p }) => p.kind === "inductor" && otherNet(p, net) === other);
    if (tank) continue;
    found.push(part);
  }
  return found;
}
function isAcGround(net, index, test) {
  if (net === void 0) return false;
  if (test.isSupply(net)) return true;
  return groundingCapacitors(net, index, test, test.minimumFarads).length > 0;
}
function outputsOn(net, index, except) {
  if (net === void 0) return [];
  return index.partsOn(net).filter(({ part, role }) => part.ref !== except && isActive(part) && role === terminalsOf(part.kind)?.output).map(({ part }) => part);
}
function classifyStage(part, index, test) {
  const terminals = terminalsOf(part.kind);
  if (!terminals) return void 0;
  const nets = {};
  for (const role of Object.keys(part.roles)) {
    const net = netOfRole(part, role);
    if (net !== void 0) nets[role] = net;
  }
  const control = nets[terminals.control];
  const output = nets[terminals.output];
  const common = nets[terminals.common];
  const acControl = isAcGround(control, index, test);
  const acOutput = isAcGround(output, index, test);
  const acCommon = isAcGround(common, index, test);
  const fedByDevice = outputsOn(common, index, part.ref).length > 0;
  const bipolar = part.kind === "npn" || part.kind === "pnp";
  let kind;
  if (fedByDevice && !acCommon && !acOutput) kind = "cb";
  else if (acOutput && !acControl && !acCommon) kind = "cc";
  else if (!acControl && !acOutput) kind = "ce";
  else if (acControl && !acCommon && !acOutput) kind = "cb";
  else kind = "unknown";
  const names = bipolar ? { ce: "common-emitter", cb: "common-base", cc: "common-collector", unknown: "unknown" } : { ce: "common-source", cb: "common-gate", cc: "common-drain", unknown: "unknown" };
  return { ref: part.ref, part, type: part.kind, configuration: names[kind], nets };
}
function findStacks(devices, index, test) {
  const above = /* @__PURE__ */ new Map();
  const hasBelow = /* @__PURE__ */ new Set();
  for (const lower of devices) {
    const lowerTop = netOfRole(lower, terminalsOf(lower.kind)?.top ?? "");
    if (lowerTop === void 0 || test.isSupply(lowerTop)) continue;
    const upper = devices.find((d) => d.ref !== lower.ref && netOfRole(d, terminalsOf(d.kind)?.bottom ?? "") === lowerTop);
    if (upper && !hasBelow.has(upper.ref)) {
      above.set(lower.ref, upper);
      hasBelow.add(upper.ref);
    }
  }
  const stacks = [];
  for (const bottom of devices) {
    if (hasBelow.has(bottom.ref) || !above.has(bottom.ref)) continue;
    const chain = [bottom];
    const seen = /* @__PURE__ */ new Set([bottom.ref]);
    for (let next = above.get(bottom.ref); next && !seen.has(next.ref); next = above.get(next.ref)) {
      chain.push(next);
      seen.add(next.ref);
    }
    const top = chain[chain.length - 1] ?? bottom;
    const topNet = netOfRole(top, terminalsOf(top.kind)?.top ?? "");
    const path = topNet === void 0 ? void 0 : pathToSupply(topNet, index, test);
    stacks.push({ refs: chain.map((p) => p.ref), rail: path?.rail ?? "", loads: path?.parts.map((p) => p.ref) ?? [] });
  }
  return stacks;
}
function pathToSupply(start, index, test, maxParts = 4) {
  if (test.isSupply(start) && !test.isGround(start)) return { rail: start, parts: [] };
  const visited = /* @__PURE__ */ new Set([start]);
  let frontier = [{ net: start, parts: [] }];
  for (let depth = 0; depth < maxParts && frontier.length > 0; depth++) {
    const next = [];
    for (const { net, parts } of frontier) {
      for (const { part } of index.partsOn(net)) {
        if (!SERIES_DC_KINDS.has(part.kind)) continue;
        const other = otherNet(part, net);
        if (other === void 0 || visited.has(other) || test.isGround(other)) continue;
        visited.add(other);
        const path = [...parts, part];
        if (test.isSupply(other)) return { rail: other, parts: path };
        next.push({ net: other, parts: path });
      }
    }
    frontier = next;
  }
  return void 0;
}
function dcNeighbourhood(start, index, isSupply, limit = 200) {
  const nets = /* @__PURE__ */ new Set([start]);
  const parts = /* @__PURE__ */ new Map();
  const queue = [start];
  while (queue.length > 0 && nets.size < limit) {
    const net = queue.shift();
    if (net === void 0) break;
    for (const { part } of index.partsOn(net)) {
      if (!SERIES_DC_KINDS.has(part.kind)) continue;
      parts.set(part.ref, part);
      const other = otherNet(part, net);
      if (other === void 0 || nets.has(other)) continue;
      nets.add(other);
      if (!isSupply(other)) queue.push(other);
    }
  }
  return { nets: [...nets], parts: [...parts.values()] };
}

// rules/bias-centre.ts
var ID2 = "bias-centre";
var doc2 = {
  what: "Every transistor used as an amplifier (common emitter/base/collector, common source/gate/drain, both channels of a dual-gate MOSFET) must be in its amplifying region at the operating point \u2014 forward-active for a bipolar device, saturation (pinch-off) for a FET; saturation, cut-off or reverse (triode or cut-off) is an error. A common-emitter or common-source stage with a resistive load is placed on its DC load line, between the saturation edge (VCE(sat), or VDS(sat) = VGS \u2212 VTO) and the cut-off end (the load's supply less what the emitter or source network returns to); outside the allowed fraction of that span (25 %\u201375 % by default) is a warning, with the load resistor that would centre it at the same current. A device whose base or gate is DC-driven from a logic IC or a connector is taken as a switch and not judged.",
  why: "A stage biased near one end of its load line clips one half of the waveform long before the other: near saturation the negative peaks flatten, near cut-off the positive ones, and the asymmetry appears as even-order distortion and a gain that moves with signal level. A device in saturation or cut-off does not amplify at all \u2014 usually a divider resistor in the wrong place, a swapped value or an open bias path.",
  fix: "Move the bias point: change the collector (drain) resistor toward the value given, or the emitter resistor or divider that sets the current. For a device in the wrong region, check the bias network's values and connections first.",
  references: [
    "DC load line and the mid-point Q point: R. L. Boylestad and L. Nashelsky, Electronic Devices and Circuit Theory, ch. 4",
    "Centring the Q point on the load line: A. P. Malvino and D. J. Bates, Electronic Principles",
    "Operating regions: Ebers\u2013Moll (bipolar) and Shichman\u2013Hodges (FET) models",
    "The 25 %\u201375 % window: common practice, our default"
  ],
  example: "9 V common-emitter stage, divider 56 k/10 k, RE 680 \u03A9, 2N3904: IC 0.94 mA, VCE 4.69 V, about half way along its 0.2\u20139 V span, no finding. With RC 8.2 k\u03A9 instead of 3.9 k\u03A9, VCE falls to 0.71 V, 6 % of the span: a warning, and about 4.0 k\u03A9 (3.9 k\u03A9 in E24) would centre it."
};
var options2 = {
  low: {
    type: "number",
    default: 0.25,
    description: "Lowest allowed position on the load line, as a fraction from the saturation edge (0) to cut-off (1)."
  },
  high: {
    type: "number",
    default: 0.75,
    description: "Highest allowed position on the load line, as a fraction from the saturation edge (0) to cut-off (1)."
  }
};
function drivenFromOutside(ctx, stage) {
  const t = terminalsOf(stage.part.kind);
  const controls = stage.type === "dual-gate-mosfet" ? ["G1", "G2"] : t ? [t.control] : [];
  return controls.some((role) => {
    const net = stage.nets[role];
    if (net === void 0 || ctx.isSupply(net)) return false;
    return ctx.dcNetwork(net).nets.some((n) => !ctx.isSupply(n) && ctx.partsOn(n).some(({ part }) => part.kind === "other" || part.kind === "connector"));
  });
}
function shown(value, unit) {
  return si(Math.abs(value) < (unit === "V" ? 1e-6 : 1e-12) ? 0 : value, unit);
}
var AMPLIFYING_BJT = /* @__PURE__ */ new Set(["active"]);
var AMPLIFYING_FET = /* @__PURE__ */ new Set(["saturation"]);
var REGION_TEXT = {
  saturation: "saturation",
  "cut-off": "cut-off",
  reverse: "reverse-active (collector and emitter swapped?)",
  triode: "the triode (ohmic) region"
};
function isAmplifying(device) {
  if (device.kind === "bjt") return AMPLIFYING_BJT.has(device.region);
  if (device.kind === "jfet" || device.kind === "mosfet") return AMPLIFYING_FET.has(device.region);
  return true;
}
function regionFinding(ctx, stage, device, channel2) {
  const who = channel2 ? `${stage.ref} (gate-${channel2 === "g1" ? "1" : "2"} channel)` : stage.ref;
  const region2 = device.kind === "diode" ? device.region : device.region;
  const figures = device.kind === "bjt" ? `VBE ${shown(device.vbe, "V")}, VCE ${shown(device.vce, "V")}, IC ${shown(device.ic, "A")}` : device.kind === "diode" ? "" : `VGS ${shown(device.vgs, "V")}, VDS ${shown(device.vds, "V")}, ID ${shown(device.id, "A")}`;
  const wanted = device.kind === "bjt" ? "forward-active" : "saturation (pinch-off)";
  const hint = region2 === "cut-off" ? "It carries no signal current: check that the base/gate bias reaches the device and the emitter/source returns to its supply." : "It has no gain left: check the collector/drain load and the bias divider for a value too large or in the wrong place.";
  return finding(ctx, ID2, {
    at: stage.part,
    severity: "error",
    message: `${who}, a ${stage.configuration} stage, is in ${REGION_TEXT[region2] ?? region2} at the operating point (${figures}), not ${wanted} where it should amplify. ${hint}`,
    parts: [stage.ref],
    nets: Object.values(stage.nets),
    data: { region: region2, configuration: stage.configuration, ...channel2 ? { channel: channel2 } : {}, ...numericFigures(device) }
  });
}
function numericFigures(device) {
  const out = {};
  for (const [k, v] of Object.entries(device)) if (typeof v === "number" && Number.isFinite(v) && ["vbe", "vce", "ic", "vgs", "vds", "id"].includes(k)) out[k] = v;
  return out;
}
function returnPotential(ctx, net) {
  if (ctx.isGround(net)) return 0;
  const rail = ctx.rail(net);
  if (rail) return rail.volts;
  const reached = ctx.dcNetwork(net).nets.filter((n) => ctx.isSupply(n));
  if (reached.some((n) => ctx.isGround(n))) return 0;
  const volts = [...new Set(reached.map((n) => ctx.rail(n)?.volts).filter((v) => v !== void 0))];
  return volts.length === 1 ? volts[0] : void 0;
}
function loadLineOf(ctx, stage) {
  const t = terminalsOf(stage.part.kind);
  if (!t) return void 0;
  const output = stage.nets[t.output];
  const common = stage.nets[t.common];
  if (output === void 0 || common === void 0 || ctx.isSupply(output)) return void 0;
  const pType = stage.part.kind === "pnp" || stage.part.kind === "pjfet" || stage.part.kind === "pmos";
  const commonReturn = returnPotential(ctx, common);
  if (commonReturn === void 0) return void 0;
  if (!pType) {
    const path = ctx.supplyPath(output);
    const first = path?.parts[0];
    if (!path || first?.kind !== "resistor") return void 0;
    const rail = ctx.rail(path.rail);
    return rail ? { load: first, loadSupplyVolts: rail.volts, commonReturnVolts: commonReturn } : void 0;
  }
  const toGround = ctx.partsOn(output).find(({ part }) => part.kind === "resistor" && ctx.isGround(otherNet(part, output) ?? ""));
  return toGround ? { load: toGround.part, loadSupplyVolts: 0, commonReturnVolts: commonReturn } : void 0;
}
var biasCentre = {
  id: ID2,
  title: "Amplifying devices are biased in their active region, near the middle of the load line",
  severity: "warning",
  doc: doc2,
  options: options2,
  tags: ["bias"],
  check(ctx, opts) {
    const low = numberOption(opts, "low", 0.25);
    const high = numberOption(opts, "high", 0.75);
    const stages = ctx.stages().filter((s) => s.configuration !== "unknown" && !drivenFromOutside(ctx, s));
    if (stages.length === 0) return [];
    if (!ctx.operatingPoint()) {
      ctx.noteLimited(ID2, `no operating point (${ctx.operatingPointProblem() ?? "not solved"}): bias not checked`, stages.map((s) => s.ref));
      return [];
    }
    const findings = [];
    for (const stage of stages) {
      const channels = stage.type === "dual-gate-mosfet" ? ["g1", "g2"] : [void 0];
      let wrongRegion = false;
      for (const channel2 of channels) {
        const device2 = ctx.device(stage.ref, channel2);
        if (!device2) {
          ctx.noteLimited(ID2, "a device has no operating point", [stage.ref]);
          continue;
        }
        if (!isAmplifying(device2)) {
          wrongRegion = true;
          findings.push(regionFinding(ctx, stage, device2, channel2));
        }
      }
      if (wrongRegion) continue;
      if (stage.configuration !== "common-emitter" && stage.configuration !== "common-source") continue;
      if (stage.type === "dual-gate-mosfet") continue;
      const device = ctx.device(stage.ref);
      const edge = ctx.saturationEdge(stage.ref);
      const line = loadLineOf(ctx, stage);
      if (!device || device.kind === "diode" || !edge || !line) continue;
      const volts = device.kind === "bjt" ? device.vce : device.vds;
      const amps = device.kind === "bjt" ? device.ic : device.id;
      const label = device.kind === "bjt" ? "VCE" : "VDS";
      const cutoff = Math.abs(line.loadSupplyVolts - line.commonReturnVolts);
      const span = cutoff - edge.volts;
      if (!(span > 0)) continue;
      const fraction = (volts - edge.volts) / span;
      if (fraction >= low && fraction <= high) continue;
      const centre = edge.volts + span / 2;
      const loadOhms2 = line.load.parsed.number;
      const centringOhms = loadOhms2 !== void 0 && amps > 0 ? loadOhms2 + (volts - centre) / amps : void 0;
      const bipolar = device.kind === "bjt";
      const lowEdge = bipolar ? "the saturation edge" : "the triode (ohmic) edge, VDS(sat)";
      const end = fraction < low ? bipolar ? "saturation" : "the triode region" : "cut-off";
      const clips = fraction < low ? "negative" : "positive";
      const series2 = ctx.config.series.resistor;
      const stock = centringOhms !== void 0 && centringOhms > 0 ? ctx.snapNearest(centringOhms, series2) : void 0;
      const suggestion = centringOhms !== void 0 && centringOhms > 0 ? ` At the same ${bipolar ? "IC" : "ID"} (${si(amps, "A")}), ${line.load.ref} of about ${si(centringOhms, "\u03A9")} (${si(stock ?? centringOhms, "\u03A9")} in ${series2}) instead of ${si(loadOhms2 ?? 0, "\u03A9")} would centre it.` : "";
      findings.push(finding(ctx, ID2, {
        at: stage.part,
        severity: "warning",
        message: `${stage.ref} (${stage.configuration}) sits at ${label} ${si(volts, "V")}, ${Math.round(fraction * 100)} % of the way along its load line from ${lowEdge} (${si(edge.volts, "V")}) to cut-off (${si(cutoff, "V")}), outside ${Math.round(low * 100)} %\u2013${Math.round(high * 100)} %: it is close to ${end}, so the output's ${clips} peaks clip first.${suggestion}`,
        parts: [stage.ref, line.load.ref],
        nets: Object.values(stage.nets),
        data: {
          volts,
          amps,
          satVolts: edge.volts,
          cutoffVolts: cutoff,
          fraction,
          low,
          high,
          centreVolts: centre,
          ...centringOhms !== void 0 && centringOhms > 0 ? { centringOhms } : {},
          ...stock !== void 0 ? { centringSeriesOhms: stock } : {},
          ...loadOhms2 !== void 0 ? { loadOhms: loadOhms2 } : {}
        }
      }));
    }
    return findings;
  }
};

// rules/corner-frequency.ts
var ID3 = "corner-frequency";
var doc3 = {
  what: "Finds every series coupling capacitor (between two signal nets, one of them a transistor terminal or a connector) and every emitter or source bypass capacitor, solves the resistance each one works into at the band's low edge \u2014 transistors at their operating point, the other coupling and bypass capacitors taken as shorts, coaxial connectors as a 50 \u03A9 port \u2014 and checks that its high-pass corner 1/(2\u03C0RC) lies at or below f_low/margin. For an emitter bypass that resistance is RE \u2225 (r_e + R's/(\u03B2+1)), for a source bypass RS \u2225 1/gm, for a coupling capacitor the source plus the load.",
  why: "Every coupling and bypass capacitor is a high-pass corner. Sized against the wrong resistance \u2014 an emitter bypass against RE rather than the few ohms the emitter presents \u2014 it comes out too small by the ratio of the two and the gain falls away at the bottom of the band. A corner a decade below the band costs 0.04 dB and under 6\xB0 there.",
  fix: "Raise the capacitor to the value suggested (snapped up to the configured capacitor series), or, where the corner is deliberate (a high-pass that sets the band), raise the band's low edge in loadline.json or suppress the finding on the part with a reason.",
  references: [
    "Per-capacitor corners f_LS = 1/(2\u03C0(Rs+Ri)Cs), f_LC = 1/(2\u03C0(Ro+RL)Cc), f_LE = 1/(2\u03C0R_e\xB7CE), R_e = RE \u2225 (R's/\u03B2 + r_e): R. L. Boylestad and L. Nashelsky, Electronic Devices and Circuit Theory, ch. 9",
    "Short-circuit time constants for the low-frequency response: A. S. Sedra and K. C. Smith, Microelectronic Circuits",
    "Xc \u2264 R/10 at the lowest frequency: A. P. Malvino and D. J. Bates, Electronic Principles (the factor 10 is common practice)",
    "Connectors as 50 \u03A9 ports: common RF practice"
  ],
  example: "Common-emitter stage, RE 2 k\u03A9, divider 40 k/10 k, 1 k\u03A9 source, \u03B2 100 at 1.65 mA: the emitter presents 24.4 \u03A9, so a 20 \xB5F bypass has its corner at 327 Hz \u2014 fine for an HF band, a warning for an audio band from 100 Hz."
};
var options3 = {
  margin: {
    type: "number",
    default: 10,
    description: "How far below the band's low edge a corner must sit: corner \u2264 f_low/margin (10 keeps the loss at the edge under 0.05 dB)."
  },
  portOhms: {
    type: "number",
    default: 50,
    unit: "ohm",
    description: "Source or load resistance a coaxial connector (BNC, SMA, \u2026) presents to a coupling capacitor (an RF port is 50 \u03A9); other connectors are left open, their load unknown."
  }
};
function deviceTerminalsOn(ctx, net) {
  return ctx.partsOn(net).filter(({ part }) => terminalsOf(part.kind) !== void 0).map(({ part, role }) => ({ part, role }));
}
function isTankNode(ctx, net) {
  const toSupply = (kind) => ctx.partsOn(net).some(({ part }) => {
    const other = otherNet(part, net);
    return other !== void 0 && ctx.isSupply(other) && (kind === "L" ? part.kind === "inductor" : isCapacitor(part));
  });
  return toSupply("L") && toSupply("C");
}
function findCandidates(ctx) {
  const out = [];
  for (const part of ctx.circuit.parts) {
    if (part.dnp || !isCapacitor(part)) continue;
    const nets = Object.values(part.pins);
    if (nets.length !== 2) continue;
    const [n1 = "", n2 = ""] = nets;
    if (n1 === n2) continue;
    const s1 = ctx.isSupply(n1);
    const s2 = ctx.isSupply(n2);
    if (s1 && s2) continue;
    if (s1 || s2) {
      const x = s1 ? n2 : n1;
      const common = deviceTerminalsOn(ctx, x).find(({ part: d, role }) => terminalsOf(d.kind)?.common === role);
      if (!common) continue;
      const bipolar = common.part.kind === "npn" || common.part.kind === "pnp";
      out.push({ cap: part, role: bipolar ? "emitter-bypass" : "source-bypass", a: x, b: s1 ? n1 : n2, device: common.part });
      continue;
    }
    const across = ctx.partsOn(n1).some(({ part: p }) => p.ref !== part.ref && otherNet(p, n1) === n2);
    if (across) continue;
    const t1 = deviceTerminalsOn(ctx, n1);
    const t2 = deviceTerminalsOn(ctx, n2);
    if (t1.some((x) => t2.some((y) => y.part.ref === x.part.ref))) continue;
    const connector = (n) => ctx.partsOn(n).some(({ part: p }) => p.kind === "connector");
    if (t1.length === 0 && t2.length === 0 && !connector(n1) && !connector(n2)) continue;
    if (isTankNode(ctx, n1) || isTankNode(ctx, n2)) continue;
    out.push({ cap: part, role: "coupling", a: n1, b: n2, device: t1[0]?.part ?? t2[0]?.part });
  }
  return out.sort((x, y) => byRef(x.cap, y.cap));
}
function isCoaxial(part) {
  return /coax|bnc|sma|smb|mcx|mmcx|u\.fl|ipex|f-type/i.test(`${part.libId} ${part.value} ${part.footprint}`);
}
function portTerminations(ctx, portOhms) {
  const out = [];
  for (const part of ctx.circuit.parts) {
    if (part.dnp || part.kind !== "connector" || !isCoaxial(part)) continue;
    for (const [pin, net] of Object.entries(part.pins)) {
      if (ctx.isSupply(net)) continue;
      const node = ctx.nodeOf(net);
      if (node !== void 0) out.push({ kind: "C", name: `Cport_${part.ref}_${pin}`, a: node, b: "0", farads: 1, esr: portOhms });
    }
  }
  return out;
}
var ROLE_TEXT = {
  coupling: "coupling capacitor",
  "emitter-bypass": "emitter bypass",
  "source-bypass": "source bypass"
};
var cornerFrequency = {
  id: ID3,
  title: "Coupling and bypass capacitors keep their corners below the band",
  severity: "warning",
  doc: doc3,
  options: options3,
  tags: ["bias", "values"],
  check(ctx, opts) {
    const margin = numberOption(opts, "margin", 10);
    const portOhms = numberOption(opts, "portOhms", 50);
    const candidates3 = findCandidates(ctx);
    if (candidates3.length === 0) return [];
    if (!ctx.operatingPoint()) {
      ctx.noteLimited(ID3, `no operating point (${ctx.operatingPointProblem() ?? "not solved"}): corners not computed`, candidates3.map((c) => c.cap.ref));
      return [];
    }
    const fLow = ctx.band.low;
    const series2 = ctx.config.series.capacitor;
    const terminations = portTerminations(ctx, portOhms);
    const shortable = ctx.circuit.parts.filter((p) => !p.dnp && isCapacitor(p)).map((p) => p.ref);
    const candidateRefs = new Set(candidates3.map((c) => c.cap.ref));
    const findings = [];
    const unmodelled = new Set(ctx.unmodelled().map((u) => u.ref));
    for (const c of candidates3) {
      const farads = c.cap.parsed.number;
      if (farads === void 0 || !(farads > 0)) continue;
      const missing = [c.device?.ref, ...ctx.devices().filter((d) => Object.values(d.pins).some((n) => n === c.a || n === c.b)).map((d) => d.ref)].filter((r) => r !== void 0 && unmodelled.has(r));
      if (missing.length > 0) {
        ctx.noteLimited(ID3, `${c.cap.ref} not judged: ${[...new Set(missing)].join(", ")} not modelled`, [c.cap.ref, ...new Set(missing)]);
        continue;
      }
      const others = shortable.filter((ref) => ref !== c.cap.ref && (candidateRefs.has(ref) || isBypassOfSignalNode(ctx, ref)));
      const options8 = { passiveOnly: false, without: [c.cap.ref], shorted: others, extra: terminations };
      const points = c.role === "coupling" ? ctx.impedanceBetween(c.a, c.b, [fLow], options8) : ctx.impedance(c.a, [fLow], options8);
      const seen = points?.[0];
      if (!seen || !(seen.magnitude > 0) || !Number.isFinite(seen.magnitude)) {
        ctx.noteLimited(ID3, "the resistance a capacitor works into could not be solved", [c.cap.ref]);
        continue;
      }
      const ohms = seen.magnitude;
      const corner = highPassCorner(ohms, farads);
      const allowed = fLow / margin;
      if (corner <= allowed * (1 + 1e-9)) continue;
      const neededFarads = faradsForReactance(ohms, fLow / margin);
      const suggested = ctx.snapUp(neededFarads, series2);
      const severe = corner > fLow;
      const lossDb = highPassLossDb(fLow, corner);
      const who = c.device ? ` of ${c.device.ref}` : "";
      const nets = c.role === "coupling" ? `between ${c.a} and ${c.b}` : `on ${c.a}`;
      findings.push(finding(ctx, ID3, {
        at: c.cap,
        severity: severe ? "warning" : "note",
        message: `${c.cap.ref} (${si(farads, "F")}, ${ROLE_TEXT[c.role]}${who} ${nets}) works into ${si(ohms, "\u03A9")} at the operating point, so its corner is ${si(corner, "Hz")} \u2014 ${severe ? `above the band's low edge ${si(fLow, "Hz")} (about ${lossDb.toFixed(1)} dB lost there)` : `within a factor ${margin} of the band's low edge ${si(fLow, "Hz")}`}, band ${bandText(ctx)}. Use at least ${si(neededFarads, "F")} (e.g. ${si(suggested, "F")}) for a corner at ${si(allowed, "Hz")}.`,
        parts: [c.cap.ref, ...c.device ? [c.device.ref] : []],
        nets: c.role === "coupling" ? [c.a, c.b] : [c.a],
        data: {
          role: c.role,
          farads,
          seenOhms: ohms,
          cornerHertz: corner,
          bandLowHertz: fLow,
          margin,
          neededFarads,
          suggestedFarads: suggested,
          lossAtEdgeDb: lossDb
        }
      }));
    }
    return findings;
  }
};
function isBypassOfSignalNode(ctx, ref) {
  const part = ctx.part(ref);
  if (!part) return false;
  const nets = Object.values(part.pins);
  return nets.length === 2 && nets.some((n) => ctx.isSupply(n)) && nets.some((n) => !ctx.isSupply(n));
}

// src/solve/eseries.ts
var E24 = [1, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2, 2.2, 2.4, 2.7, 3, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];
var E192_HUNDREDTHS = [
  100,
  101,
  102,
  104,
  105,
  106,
  107,
  109,
  110,
  111,
  113,
  114,
  115,
  117,
  118,
  120,
  121,
  123,
  124,
  126,
  127,
  129,
  130,
  132,
  133,
  135,
  137,
  138,
  140,
  142,
  143,
  145,
  147,
  149,
  150,
  152,
  154,
  156,
  158,
  160,
  162,
  164,
  165,
  167,
  169,
  172,
  174,
  176,
  178,
  180,
  182,
  184,
  187,
  189,
  191,
  193,
  196,
  198,
  200,
  203,
  205,
  208,
  210,
  213,
  215,
  218,
  221,
  223,
  226,
  229,
  232,
  234,
  237,
  240,
  243,
  246,
  249,
  252,
  255,
  258,
  261,
  264,
  267,
  271,
  274,
  277,
  280,
  284,
  287,
  291,
  294,
  298,
  301,
  305,
  309,
  312,
  316,
  320,
  324,
  328,
  332,
  336,
  340,
  344,
  348,
  352,
  357,
  361,
  365,
  370,
  374,
  379,
  383,
  388,
  392,
  397,
  402,
  407,
  412,
  417,
  422,
  427,
  432,
  437,
  442,
  448,
  453,
  459,
  464,
  470,
  475,
  481,
  487,
  493,
  499,
  505,
  511,
  517,
  523,
  530,
  536,
  542,
  549,
  556,
  562,
  569,
  576,
  583,
  590,
  597,
  604,
  612,
  619,
  626,
  634,
  642,
  649,
  657,
  665,
  673,
  681,
  690,
  698,
  706,
  715,
  723,
  732,
  741,
  750,
  759,
  768,
  777,
  787,
  796,
  806,
  816,
  825,
  835,
  845,
  856,
  866,
  876,
  887,
  898,
  909,
  920,
  931,
  942,
  953,
  965,
  976,
  988
];
var E96_HUNDREDTHS = [
  100,
  102,
  105,
  107,
  110,
  113,
  115,
  118,
  121,
  124,
  127,
  130,
  133,
  137,
  140,
  143,
  147,
  150,
  154,
  158,
  162,
  165,
  169,
  174,
  178,
  182,
  187,
  191,
  196,
  200,
  205,
  210,
  215,
  221,
  226,
  232,
  237,
  243,
  249,
  255,
  261,
  267,
  274,
  280,
  287,
  294,
  301,
  309,
  316,
  324,
  332,
  340,
  348,
  357,
  365,
  374,
  383,
  392,
  402,
  412,
  422,
  432,
  442,
  453,
  464,
  475,
  487,
  499,
  511,
  523,
  536,
  549,
  562,
  576,
  590,
  604,
  619,
  634,
  649,
  665,
  681,
  698,
  715,
  732,
  750,
  768,
  787,
  806,
  825,
  845,
  866,
  887,
  909,
  931,
  953,
  976
];
var E48_HUNDREDTHS = [
  100,
  105,
  110,
  115,
  121,
  127,
  133,
  140,
  147,
  154,
  162,
  169,
  178,
  187,
  196,
  205,
  215,
  226,
  237,
  249,
  261,
  274,
  287,
  301,
  316,
  332,
  348,
  365,
  383,
  402,
  422,
  442,
  464,
  487,
  511,
  536,
  562,
  590,
  619,
  649,
  681,
  715,
  750,
  787,
  825,
  866,
  909,
  953
];
var fromHundredths = (xs) => xs.map((x) => Number(`${x}e-2`));
var E_SERIES = {
  E3: [1, 2.2, 4.7],
  E6: [1, 1.5, 2.2, 3.3, 4.7, 6.8],
  E12: [1, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2],
  E24,
  E48: fromHundredths(E48_HUNDREDTHS),
  E96: fromHundredths(E96_HUNDREDTHS),
  E192: fromHundredths(E192_HUNDREDTHS)
};
var SERIES_TOLERANCE = {
  E3: 0.4,
  E6: 0.2,
  E12: 0.1,
  E24: 0.05,
  E48: 0.02,
  E96: 0.01,
  E192: 5e-3
};
var FINEST_FIRST = ["E192", "E96", "E48", "E24", "E12", "E6", "E3"];
function candidates2(value, series2) {
  if (!(value > 0) || !Number.isFinite(value)) {
    throw new RangeError(`E-series lookup needs a positive finite value, got ${value}`);
  }
  const decade = Math.floor(Math.log10(value));
  const out = [];
  for (let d = decade - 1; d <= decade + 1; d++) {
    for (const m of E_SERIES[series2]) out.push(Number(`${m}e${d}`));
  }
  return out;
}
function isInSeries(value, series2, relTol = 1e-9) {
  if (!(value > 0) || !Number.isFinite(value)) return false;
  return candidates2(value, series2).some((c) => Math.abs(value - c) <= relTol * c);
}
function neighbours(value, series2, relTol = 1e-9) {
  const cs = candidates2(value, series2);
  let below = Number.NEGATIVE_INFINITY;
  let above = Number.POSITIVE_INFINITY;
  for (const c of cs) {
    if (c <= value * (1 + relTol) && c > below) below = c;
    if (c >= value * (1 - relTol) && c < above) above = c;
  }
  return { below, above };
}
function seriesForTolerance(tol) {
  const coarsest = [...FINEST_FIRST].reverse();
  for (const name of coarsest) {
    if (tol >= SERIES_TOLERANCE[name] * (1 - 1e-9)) return name;
  }
  return "E192";
}
var E_SERIES_NAMES = ["E3", "E6", "E12", "E24", "E48", "E96", "E192"];

// rules/e-series.ts
var ID4 = "e-series";
var doc4 = {
  what: "Checks every fitted resistor's value against the IEC 60063 series configured for resistors (E24 unless series.resistor says otherwise); capacitors too when series.capacitorCheck is true, inductors when the inductors option is on. A tolerance belonging to a finer series is respected (a 1 % part may be any E96 value). For a value outside the series it re-solves the DC operating point with each neighbouring member in its place and proposes the one that moves the transistors' VCE and IC (VDS and ID) least, as a fix edit written in the board's own style, and reports the operating point with every proposed value fitted together.",
  why: "A value outside the series has to be built from two parts or ordered specially, or it is swapped for the nearest stock value at assembly without anyone checking what that does. The nearer value is not always the kinder one: snapping a bias divider the wrong way can move a cascode's upper VCE by a quarter. The shift should be known before the swap.",
  fix: "Apply the proposed value (loadline fix does it in place) after reading the operating-point shift it causes; if the shift is too large for the design, combine two series values or use a finer series part (and state its tolerance on the part, e.g. 1 %).",
  references: [
    "IEC 60063:2015, Preferred number series for resistors and capacitors (E3\u2013E192 tables, as compiled in the project's reference notes)",
    "Series/tolerance pairing (E12 10 %, E24 5 %, E48 2 %, E96 1 %, E192 0.5 % and tighter): tables published with the standard",
    "Nearness judged by ratio, as the series are geometric: common practice"
  ],
  example: "9 V cascode, divider 51 k/25 k/14 k, RE 700 \u03A9, RC 3.3 k\u03A9, 2N3904 card: 25 k, 14 k and 700 \u03A9 are not E24. Proposed 24 k, 15 k and 680 \u03A9; all three fitted move VCE1 2.43 \u2192 2.33 V, VCE2 3.12 \u2192 2.73 V and IC1 0.866 \u2192 0.995 mA, as ngspice gives."
};
var options4 = {
  inductors: {
    type: "boolean",
    default: false,
    description: "Also check inductor values, against series.inductor (off by default: many chokes come in other value sets)."
  }
};
var VOLTS_FLOOR = 0.01;
var AMPS_FLOOR = 1e-6;
function kindOf(part) {
  if (part.kind === "resistor") return "resistor";
  if (part.kind === "capacitor" || part.kind === "polarized-capacitor") return "capacitor";
  if (part.kind === "inductor") return "inductor";
  return void 0;
}
function finer(a, b) {
  return E_SERIES_NAMES.indexOf(a) >= E_SERIES_NAMES.indexOf(b) ? a : b;
}
function oddValues(ctx, checkInductors) {
  const out = [];
  for (const part of ctx.circuit.parts) {
    if (part.dnp) continue;
    const kind = kindOf(part);
    if (kind === void 0) continue;
    if (kind === "capacitor" && !ctx.config.series.capacitorCheck) continue;
    if (kind === "inductor" && !checkInductors) continue;
    const value = part.parsed.number;
    if (value === void 0 || !(value > 0) || !Number.isFinite(value)) continue;
    const configured = ctx.config.series[kind];
    const tolerance2 = part.parsed.tolerance;
    const bySeries = tolerance2 !== void 0 ? seriesForTolerance(tolerance2) : void 0;
    const series2 = bySeries !== void 0 ? finer(configured, bySeries) : configured;
    if (isInSeries(value, configured, 1e-6) || isInSeries(value, series2, 1e-6)) continue;
    const { below, above } = neighbours(value, series2);
    if (!Number.isFinite(below) || !Number.isFinite(above)) continue;
    const seriesBasis = series2 === configured ? ctx.config.defaulted.includes(`series.${kind}`) ? `the default series for a ${kind}; set "series.${kind}" in loadline.json to change it` : `the series configured for a ${kind}` : `the series of its ${formatTolerance(tolerance2 ?? 0)} tolerance`;
    out.push({ part, kind, value, series: series2, seriesBasis, below, above });
  }
  return out.sort((a, b) => byRef(a.part, b.part));
}
function formatTolerance(tol) {
  return `${Number((tol * 100).toPrecision(3))} %`;
}
function figuresOf(point) {
  const out = [];
  for (const [name, d] of Object.entries(point.devices)) {
    const f = figuresOfDevice(name, d);
    if (f) out.push(f);
  }
  return out.sort((a, b) => a.name.localeCompare(b.name, "en", { numeric: true }));
}
function figuresOfDevice(name, d) {
  switch (d.kind) {
    case "bjt":
      return { name, volts: d.vce, amps: d.ic, voltsLabel: "VCE", ampsLabel: "IC" };
    case "jfet":
    case "mosfet":
      return { name, volts: d.vds, amps: d.id, voltsLabel: "VDS", ampsLabel: "ID" };
    case "diode":
      return void 0;
  }
}
function shiftBetween(before, afterPoint) {
  const after = figuresOf(afterPoint);
  let worst = 0;
  let worstWhat = "";
  for (const b of before) {
    const a = after.find((x) => x.name === b.name);
    if (!a) continue;
    const dv = Math.abs(a.volts - b.volts) / Math.max(Math.abs(b.volts), VOLTS_FLOOR);
    const di = Math.abs(a.amps - b.amps) / Math.max(Math.abs(b.amps), AMPS_FLOOR);
    if (dv > worst) {
      worst = dv;
      worstWhat = `${b.name} ${b.voltsLabel}`;
    }
    if (di > worst) {
      worst = di;
      worstWhat = `${b.name} ${b.ampsLabel}`;
    }
  }
  return { worst, worstWhat, after };
}
function movesText(before, after) {
  const parts = [];
  for (const b of before) {
    const a = after.find((x) => x.name === b.name);
    if (!a) continue;
    const moved = Math.abs(a.volts - b.volts) / Math.max(Math.abs(b.volts), VOLTS_FLOOR) > 1e-3 || Math.abs(a.amps - b.amps) / Math.max(Math.abs(b.amps), AMPS_FLOOR) > 1e-3;
    if (!moved) continue;
    parts.push(`${b.name} ${b.voltsLabel} ${si(b.volts, "V")} \u2192 ${si(a.volts, "V")}, ${b.ampsLabel} ${si(b.amps, "A")} \u2192 ${si(a.amps, "A")}`);
  }
  return parts.length > 0 ? parts.join("; ") : "no transistor's VCE/IC (VDS/ID) moves by more than 0.1 %";
}
var UNIT = { resistor: "\u03A9", capacitor: "F", inductor: "H" };
function percent(x) {
  return `${Number((x * 100).toPrecision(2))} %`;
}
function nearerByRatio(odd) {
  return Math.abs(Math.log(odd.value / odd.below)) <= Math.abs(Math.log(odd.above / odd.value)) ? odd.below : odd.above;
}
function choose(ctx, odd, base, before) {
  const u = UNIT[odd.kind];
  const nearest = nearerByRatio(odd);
  const common = { value: odd.value, series: odd.series, below: odd.below, above: odd.above };
  if (odd.kind !== "resistor" || !base || before.length === 0) {
    const reason = odd.kind !== "resistor" ? `a ${odd.kind} does not set the DC operating point` : !base ? `no operating point (${ctx.operatingPointProblem() ?? "not solved"})` : "no transistor in the solution";
    return { odd, chosen: nearest, by: "nearest", why: `the nearer by ratio (${reason})`, data: { ...common, chosenBy: "nearest" } };
  }
  const tries = [odd.below, odd.above].map((candidate) => {
    const point = ctx.operatingPointWith({ [odd.part.ref]: candidate });
    return { candidate, shift: point ? shiftBetween(before, point) : void 0 };
  });
  const [low, high] = tries;
  if (!low?.shift || !high?.shift) {
    const failed = tries.filter((t) => !t.shift).map((t) => si(t.candidate, u)).join(" and ");
    ctx.noteLimited(ID4, `the operating point did not converge with ${odd.part.ref} = ${failed}`, [odd.part.ref]);
    const usable2 = tries.find((t) => t.shift);
    const chosen = usable2?.candidate ?? nearest;
    return { odd, chosen, by: "nearest", why: `the only neighbour the operating point could be solved with`, data: { ...common, chosenBy: "nearest" } };
  }
  const tie = Math.abs(low.shift.worst - high.shift.worst) <= 1e-6;
  const best = tie ? nearest === odd.below ? low : high : low.shift.worst < high.shift.worst ? low : high;
  const other = best === low ? high : low;
  const bestShift = best.shift ?? low.shift;
  const otherShift = other.shift ?? high.shift;
  const why = tie ? `both neighbours leave the operating point the same (within ${percent(1e-6)}), so the nearer by ratio` : `it moves the operating point least: ${movesText(before, bestShift.after)} (largest shift ${percent(bestShift.worst)}, ${bestShift.worstWhat}); ${si(other.candidate, u)} would move it ${percent(otherShift.worst)} (${otherShift.worstWhat})`;
  const data = {
    ...common,
    chosenBy: tie ? "nearest" : "operating-point",
    devices: before.map((d) => d.name),
    beforeVolts: before.map((d) => d.volts),
    beforeAmps: before.map((d) => d.amps),
    belowVolts: before.map((d) => low.shift?.after.find((x) => x.name === d.name)?.volts ?? Number.NaN),
    belowAmps: before.map((d) => low.shift?.after.find((x) => x.name === d.name)?.amps ?? Number.NaN),
    aboveVolts: before.map((d) => high.shift?.after.find((x) => x.name === d.name)?.volts ?? Number.NaN),
    aboveAmps: before.map((d) => high.shift?.after.find((x) => x.name === d.name)?.amps ?? Number.NaN),
    belowShift: low.shift.worst,
    aboveShift: high.shift.worst
  };
  return { odd, chosen: best.candidate, by: tie ? "nearest" : "operating-point", why, data };
}
function fixFor(odd, chosen) {
  const span = odd.part.valueSpan;
  if (!span) return void 0;
  const replacement = rewriteValueText(chosen, odd.part.kind, odd.part.parsed);
  return { span, replacement, description: `${odd.part.ref} ${odd.part.value} -> ${replacement}` };
}
var eSeries = {
  id: ID4,
  title: "Part values are IEC 60063 preferred numbers",
  severity: "warning",
  doc: doc4,
  options: options4,
  tags: ["values"],
  check(ctx, opts) {
    const odds = oddValues(ctx, opts.inductors === true);
    if (odds.length === 0) return [];
    const base = ctx.operatingPoint();
    const before = base ? figuresOf(base) : [];
    const choices = odds.map((odd) => choose(ctx, odd, base, before));
    const resistorChoices = choices.filter((c) => c.odd.kind === "resistor");
    const together = {};
    for (const c of resistorChoices) together[c.odd.part.ref] = c.chosen;
    const combined = base && before.length > 0 && resistorChoices.length > 1 ? ctx.operatingPointWith(together) : void 0;
    const combinedFigures = combined ? figuresOf(combined) : void 0;
    const findings = [];
    for (const c of choices) {
      const { odd } = c;
      const u = UNIT[odd.kind];
      const fix = fixFor(odd, c.chosen);
      const data = { ...c.data, chosen: c.chosen, hasFix: fix !== void 0 };
      if (!fix) data.noFixReason = "the design was read from a netlist, which cannot be edited in place; change the value in the schematic";
      let togetherText = "";
      if (combinedFigures && odd.kind === "resistor") {
        togetherText = ` With every proposed value fitted together (${resistorChoices.map((x) => `${x.odd.part.ref} ${si(x.chosen, "\u03A9")}`).join(", ")}): ${movesText(before, combinedFigures)}.`;
        data.combinedVolts = before.map((d) => combinedFigures.find((x) => x.name === d.name)?.volts ?? Number.NaN);
        data.combinedAmps = before.map((d) => combinedFigures.find((x) => x.name === d.name)?.amps ?? Number.NaN);
      }
      const fixText = fix ? "" : " (no automatic fix: the design was read from a netlist; change it in the schematic)";
      findings.push(finding(ctx, ID4, {
        at: odd.part,
        severity: "warning",
        message: `${odd.part.ref} ${si(odd.value, u)} is not an ${odd.series} value (${odd.seriesBasis}); its neighbours are ${si(odd.below, u)} and ${si(odd.above, u)}. Use ${si(c.chosen, u)}: ${c.why}.${togetherText}${fixText}`,
        parts: [odd.part.ref],
        nets: Object.values(odd.part.pins),
        data,
        ...fix ? { fix } : {}
      }));
    }
    return findings;
  }
};

// rules/gate-protection.ts
var ID5 = "gate-protection";
var ESD = "MOSFET gates are damaged by static: handle the part as its datasheet instructs (antistatic precautions) when fitting and testing.";
var doc5 = {
  what: "For every MOSFET gate (both gates of a dual-gate MOSFET): a DC path to a defined potential (resistors or inductors to ground, a rail, a source or another device's output) \u2014 a floating gate is an error naming the gate net and the part; where the gate can be reached from an external connector, antenna or coil input through capacitors, resistors and inductors, a clamp (diodes or a zener to ground or a rail, or gate to source, or protection built into the part, as the parts library records or, for a part it does not know, the symbol's description states) \u2014 missing, a warning; the DC gate-source voltage at the operating point within the gate rating (VGS max, or the built-in diodes' breakdown) \u2014 beyond it, an error; and where the gate reaches a rail, the rail alone against the rating. For every junction FET, a gate junction forward-biased at the operating point (VGS above +0.5 V for an n-channel device unless set) is a warning.",
  why: "An insulated gate is a few picofarads with nothing to bleed its charge: floating, it drifts with leakage and static and takes the drain current with it, and a few tens of volts \u2014 less than a touch delivers \u2014 punch through the oxide. A gate wired to an antenna or an input socket meets exactly those charges. A forward-biased JFET gate draws current from the source, loads it and rectifies the signal.",
  fix: "Give a floating gate a resistor to its bias point (ground, or the divider that sets it). Clamp a gate that can be reached from outside with a pair of small-signal diodes or a low-voltage zener to ground, close to the gate, with a series resistor ahead of it if the source can deliver current; or use a part with built-in gate protection. Keep the gate-source voltage inside the datasheet's rating, and keep a JFET gate at or below its source.",
  references: [
    "Gate ratings and handling: device datasheets (2N7000: VGSS \xB120 V continuous, no gate protection diode; BF998: integrated back-to-back gate protection diodes, V(BR)G1SS/G2SS \xB18 to \xB112 V, antistatic handling still required), as compiled in the project's reference notes \xA74.3, \xA74.4",
    "JFET gate forward-biased above about +0.5 V: common practice (J310 datasheet: VGS(f) \u2264 1.0 V at IG 1 mA), reference notes \xA74.2",
    "Antistatic handling of MOS parts and unprotected gates on external connections: common practice, reference notes \xA77"
  ],
  example: "A 2N7000 common-source stage fed from a BNC input through 100 nF, 1 M\u03A9 from gate to ground: a DC path exists, but no clamp and no built-in protection \u2014 a warning. A BF998 stage fed the same way passes; with gate 1's resistor left off, gate 1 floats \u2014 an error."
};
var options5 = {
  jfetForwardVolts: {
    type: "number",
    default: 0.5,
    unit: "V",
    description: "Gate-source voltage (n-channel sense) above which a JFET's gate junction counts as forward-biased."
  }
};
var INSULATED = /* @__PURE__ */ new Set(["nmos", "pmos", "dual-gate-mosfet"]);
var DRIVEN_ROLES = /* @__PURE__ */ new Set(["C", "E", "D", "S"]);
var PASSING_KINDS = /* @__PURE__ */ new Set(["resistor", "capacitor", "polarized-capacitor", "inductor"]);
var SEARCH_LIMIT = 400;
function gatesOf(ctx) {
  const out = [];
  for (const part of ctx.devices()) {
    if (!INSULATED.has(part.kind)) continue;
    const roles = part.kind === "dual-gate-mosfet" ? ["G1", "G2"] : ["G"];
    const sourceNet = ctx.netOf(part.ref, "S");
    for (const role of roles) {
      const net = ctx.netOf(part.ref, role);
      if (net === void 0) continue;
      const name = role === "G" ? "the gate" : role === "G1" ? "gate 1" : "gate 2";
      out.push({ part, role, net, name, ...sourceNet !== void 0 ? { sourceNet } : {} });
    }
  }
  return out;
}
function definedBy(ctx, gate) {
  if (ctx.isSupply(gate.net)) return gate.net;
  const network = ctx.dcNetwork(gate.net);
  const supply = network.nets.find((n) => ctx.isSupply(n));
  if (supply !== void 0) return supply;
  for (const net of network.nets) {
    for (const { part, role } of ctx.partsOn(net)) {
      if (part.ref === gate.part.ref && role === gate.role) continue;
      if (part.kind === "voltage-source" || part.kind === "battery" || part.kind === "current-source") return part.ref;
      if (part.kind === "other") return part.ref;
      const active = ["npn", "pnp", "njfet", "pjfet", "nmos", "pmos", "dual-gate-mosfet"].includes(part.kind);
      if (active && DRIVEN_ROLES.has(role)) return part.ref;
    }
  }
  return void 0;
}
function isEntry(part) {
  if (part.kind === "connector") return true;
  const text = `${part.libId} ${part.value}`;
  if (/antenna/i.test(text) || /^(AE|ANT)\d/i.test(part.ref)) return true;
  return part.kind === "other" && (/transformer|balun/i.test(text) || /^T\d/i.test(part.ref));
}
function reachFromOutside(ctx, gateNet) {
  const previous = /* @__PURE__ */ new Map([[gateNet, null]]);
  const queue = [gateNet];
  while (queue.length > 0 && previous.size < SEARCH_LIMIT) {
    const net = queue.shift();
    if (net === void 0) break;
    const entry = ctx.partsOn(net).find(({ part }) => isEntry(part));
    if (entry) {
      const nets = [];
      const parts = [];
      for (let cursor = net; cursor !== void 0; ) {
        nets.unshift(cursor);
        const step = previous.get(cursor);
        if (!step) break;
        parts.unshift(step.part);
        cursor = step.net;
      }
      return { entry: entry.part, nets, parts };
    }
    if (ctx.isSupply(net)) continue;
    for (const { part } of ctx.partsOn(net)) {
      if (!PASSING_KINDS.has(part.kind)) continue;
      const next = otherNet(part, net);
      if (next === void 0 || previous.has(next) || ctx.isSupply(next)) continue;
      previous.set(next, { net, part });
      queue.push(next);
    }
  }
  return void 0;
}
function clampsOn(ctx, nets, gate) {
  const found = /* @__PURE__ */ new Map();
  for (const net of nets) {
    for (const { part } of ctx.partsOn(net)) {
      if (part.kind !== "diode" && part.kind !== "zener") continue;
      const others = Object.values(part.pins).filter((n) => n !== net);
      if (others.some((other) => ctx.isSupply(other) || net === gate.net && other === gate.sourceNet)) found.set(part.ref, part);
    }
  }
  return [...found.values()].sort(byRef);
}
function builtInProtection(part, ratings2) {
  if (ratings2?.gateProtection !== void 0) {
    return { protected: ratings2.gateProtection, basis: ratings2.gateProtection ? "the parts library" : `the ${part.value || "part"} has no built-in gate protection` };
  }
  const said = Object.entries(part.fields).some(([k, v]) => /^(description|ki_description)$/i.test(k) && /gate[- ]?protect|protection diode/i.test(v));
  return said ? { protected: true, basis: "the symbol's description" } : { protected: false, basis: "the part is not known to have built-in gate protection" };
}
function gateLimit(ratings2) {
  if (ratings2?.vgsMax !== void 0) return { volts: ratings2.vgsMax, basis: `the \xB1${ratings2.vgsMax} V gate-source rating` };
  const breakdown = ratings2?.vgsBreakdown?.min;
  if (breakdown !== void 0) return { volts: breakdown, basis: `the ${breakdown} V minimum breakdown of its gate protection diodes` };
  return void 0;
}
function resistanceOf(parts) {
  return parts.reduce((sum, p) => sum + (p.kind === "resistor" ? p.parsed.number ?? 0 : 0), 0);
}
var gateProtection = {
  id: ID5,
  title: "MOSFET gates are defined, clamped where exposed, and within rating; JFET gates are not forward-biased",
  severity: "warning",
  doc: doc5,
  options: options5,
  tags: ["protection", "esd"],
  check(ctx, opts) {
    const forwardVolts = numberOption(opts, "jfetForwardVolts", 0.5);
    const findings = [];
    const point = ctx.operatingPoint();
    const gates = gatesOf(ctx);
    for (const gate of gates) {
      const ref = gate.part.ref;
      const what = `${ref}'s ${gate.name === "the gate" ? "gate" : gate.name} (net ${gate.net})`;
      const defined = definedBy(ctx, gate);
      if (defined === void 0) {
        findings.push(finding(ctx, ID5, {
          at: gate.part,
          severity: "error",
          message: `${capitalise(what)} has no DC path to a defined potential: nothing but capacitors and open ends on it, so it floats with leakage and static charge and the drain current with it. Add a resistor from ${gate.net} to its bias point (ground or the divider that should set it). ${ESD}`,
          parts: [ref],
          nets: [gate.net],
          data: { gateNet: gate.net, role: gate.role, floating: true }
        }));
        continue;
      }
      const ratings2 = ctx.rating(ref);
      const protection = builtInProtection(gate.part, ratings2);
      const builtIn = protection.protected;
      const reach = reachFromOutside(ctx, gate.net);
      if (reach && !builtIn) {
        const clamps = clampsOn(ctx, reach.nets, gate);
        if (clamps.length === 0) {
          const route = reach.parts.length > 0 ? ` through ${reach.parts.map((p) => p.ref).join(", ")}` : " directly";
          const known = protection.basis;
          findings.push(finding(ctx, ID5, {
            at: gate.part,
            severity: "warning",
            message: `${capitalise(what)} can be reached from ${reach.entry.ref} (${reach.entry.value || reach.entry.kind})${route}, with no clamp on the way, and ${known}. Fit two small-signal diodes (or a low-voltage zener) from ${gate.net} to ground, close to the gate. ${ESD}`,
            parts: [ref, reach.entry.ref, ...reach.parts.map((p) => p.ref)],
            nets: reach.nets,
            data: { gateNet: gate.net, role: gate.role, entry: reach.entry.ref, path: reach.parts.map((p) => p.ref), builtInProtection: false }
          }));
        }
      }
      const limit = gateLimit(ratings2);
      if (!limit) continue;
      const vg = ctx.voltage(gate.net);
      const vs = gate.sourceNet !== void 0 ? ctx.voltage(gate.sourceNet) : void 0;
      if (point && vg !== void 0 && vs !== void 0 && Math.abs(vg - vs) > limit.volts) {
        findings.push(finding(ctx, ID5, {
          at: gate.part,
          severity: "error",
          message: `${capitalise(what)} sits at ${si(vg - vs, "V")} from the source at the operating point, beyond ${limit.basis}. Change the gate bias so |VGS| stays inside it. ${ESD}`,
          parts: [ref],
          nets: [gate.net, ...gate.sourceNet !== void 0 ? [gate.sourceNet] : []],
          data: { gateNet: gate.net, role: gate.role, vgs: vg - vs, limitVolts: limit.volts }
        }));
        continue;
      }
      const path = ctx.supplyPath(gate.net);
      const rail = path ? ctx.rail(path.rail) : void 0;
      if (!path || !rail || Math.abs(rail.volts) <= limit.volts) continue;
      const clamped = builtIn || clampsOn(ctx, [gate.net], gate).length > 0;
      const seriesOhms = resistanceOf(path.parts);
      const igMax = ratings2?.igMax;
      if (clamped) {
        if (igMax === void 0 || !(seriesOhms > 0)) continue;
        const current = (Math.abs(rail.volts) - limit.volts) / seriesOhms;
        if (current <= igMax) continue;
        findings.push(finding(ctx, ID5, {
          at: gate.part,
          severity: "warning",
          message: `${capitalise(what)} reaches ${rail.net} (${si(rail.volts, "V")}) through only ${si(seriesOhms, "\u03A9")} (${path.parts.map((p) => p.ref).join(", ")}): should the gate's bias fail, the clamp would take about ${si(current, "A")}, over the ${si(igMax, "A")} gate current rating. Raise the series resistance.`,
          parts: [ref, ...path.parts.map((p) => p.ref)],
          nets: [gate.net, rail.net],
          data: { gateNet: gate.net, role: gate.role, railVolts: rail.volts, seriesOhms, clampAmps: current, igMaxAmps: igMax }
        }));
        continue;
      }
      findings.push(finding(ctx, ID5, {
        at: gate.part,
        severity: "warning",
        message: `${capitalise(what)} reaches ${rail.net} (${si(rail.volts, "V")}) through ${path.parts.map((p) => p.ref).join(", ")}, and that rail alone exceeds ${limit.basis}: an open bias resistor or the switch-on transient would put it on the gate. Add a zener from ${gate.net} to the source or ground below the rating. ${ESD}`,
        parts: [ref, ...path.parts.map((p) => p.ref)],
        nets: [gate.net, rail.net],
        data: { gateNet: gate.net, role: gate.role, railVolts: rail.volts, limitVolts: limit.volts }
      }));
    }
    const jfets = ctx.devices().filter((p) => p.kind === "njfet" || p.kind === "pjfet");
    if (jfets.length > 0 && !point) {
      ctx.noteLimited(ID5, `no operating point (${ctx.operatingPointProblem() ?? "not solved"}): JFET gate bias not checked`, jfets.map((p) => p.ref));
    }
    if (gates.some((g) => gateLimit(ctx.rating(g.part.ref)) !== void 0) && !point) {
      ctx.noteLimited(ID5, "no operating point: MOSFET gate voltages not checked against their ratings", gates.map((g) => g.part.ref));
    }
    for (const part of jfets) {
      const device = ctx.device(part.ref);
      if (!device || device.kind !== "jfet") continue;
      if (device.vgs <= forwardVolts) continue;
      const gateNet = ctx.netOf(part.ref, "G") ?? "";
      findings.push(finding(ctx, ID5, {
        at: part,
        severity: "warning",
        message: `${part.ref}'s gate junction is forward-biased at the operating point: VGS ${si(device.vgs, "V")} (${part.kind === "pjfet" ? "p-channel, sign as for n-channel" : "n-channel"}), above +${si(forwardVolts, "V")}, and it draws ${si(device.ig, "A")} of gate current. Bias the gate at or below the source (self-bias with a source resistor, or a divider that leaves VGS negative).`,
        parts: [part.ref],
        nets: [gateNet],
        data: { vgs: device.vgs, gateAmps: device.ig, thresholdVolts: forwardVolts }
      }));
    }
    return findings;
  }
};
function capitalise(s) {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

// rules/model-coverage.ts
var ID6 = "model-coverage";
var doc6 = {
  what: "Lists, as one note per design, the parts the solver could not model (no model for a part number, an unreadable value, a kind it does not know), power nets whose voltage nothing states, a DC operating point that could not be built or did not converge, and every limitation the other rules recorded while they ran.",
  why: "A clean report means something only when every part was in the analysis. A transistor without a model drops out of the operating point, and the checks that need its bias say nothing about it; this note makes that silence visible instead of letting it pass for a pass.",
  fix: 'Give the part a value the reader understands, a part number from the built-in library, or a SPICE .model card (a Sim.Library field on the symbol, or "models" in loadline.json).',
  references: ["Model cards and parameter names: the SPICE conventions (Berkeley SPICE, ngspice manual)"],
  example: `A dual-gate MOSFET with an unknown part number and no .model card: "Not analysed: Q4 (no model for 'BF999'); limited: base-ac-ground (no operating point for Q4)".`
};
var modelCoverage = {
  id: ID6,
  title: "Every part is in the analysis, or the report says what is not",
  severity: "note",
  doc: doc6,
  options: {},
  tags: ["models"],
  check(ctx) {
    const unmodelled = ctx.unmodelled();
    const limitations = ctx.limitations().filter((l) => l.rule !== ID6);
    const solverProblem = ctx.solverProblem();
    const opProblem = solverProblem === void 0 ? ctx.operatingPointProblem() : void 0;
    const unpowered = ctx.unresolvedRails();
    if (unmodelled.length === 0 && limitations.length === 0 && solverProblem === void 0 && opProblem === void 0 && unpowered.length === 0) return [];
    const sentences = [];
    if (solverProblem !== void 0) sentences.push(`The design could not be turned into a circuit to solve: ${solverProblem}.`);
    if (opProblem !== void 0) sentences.push(`The DC operating point could not be found: ${opProblem}.`);
    if (unpowered.length > 0) {
      sentences.push(`No voltage known for ${unpowered.join(", ")}: the operating point solves ${unpowered.length === 1 ? "it as an ordinary net, powered only through what connects it" : "them as ordinary nets, powered only through what connects them"} to a rail; if ${unpowered.length === 1 ? "it is a supply, give it" : "they are supplies, give each"} a voltage under "rails" in loadline.json (e.g. "rails": { "${unpowered[0] ?? "VCC"}": "9V" }).`);
    }
    if (unmodelled.length > 0) sentences.push(`Not analysed: ${unmodelled.map((u) => `${u.ref} (${u.reason})`).join("; ")}.`);
    if (limitations.length > 0) {
      const byRule = /* @__PURE__ */ new Map();
      for (const l of limitations) byRule.set(l.rule, [...byRule.get(l.rule) ?? [], l.reason]);
      sentences.push(`Checks limited: ${[...byRule].map(([rule, reasons]) => `${rule} (${[...new Set(reasons)].join("; ")})`).join("; ")}.`);
    }
    const parts = [.../* @__PURE__ */ new Set([...unmodelled.map((u) => u.ref), ...limitations.flatMap((l) => l.parts)])].sort((a, b) => a.localeCompare(b, "en", { numeric: true }));
    const first = parts.map((ref) => ctx.part(ref)).find((p) => p !== void 0);
    return [finding(ctx, ID6, {
      at: first,
      severity: "note",
      message: sentences.join(" "),
      parts,
      nets: [],
      data: {
        unmodelled: unmodelled.map((u) => u.ref),
        limitedRules: [...new Set(limitations.map((l) => l.rule))],
        operatingPoint: solverProblem === void 0 && opProblem === void 0,
        unresolvedRails: unpowered
      }
    })];
  }
};

// rules/rail-bypass.ts
var ID7 = "rail-bypass";
var doc7 = {
  what: "For each supply rail, sweeps the impedance from the rail to ground of the passive supply network (capacitors with ESR and ESL, decoupling resistors and chokes, an on-board battery's internal resistance; an off-board supply counts as open) over the band and a decade beyond each edge. Inside the band it is judged against a target: 1/100 of the smallest collector/drain load fed from the rail by default, or the targetOhms option. Reports a rail with no bypass at all, the worst |Z| over target and where, anti-resonance peaks between two named capacitors, a missing bulk capacitor at the low end, a missing RF capacitor at the high end (every self-resonance below the band's top), and the value whose self-resonance fills the gap.",
  why: "The rail is a common path between every stage it feeds: its impedance at a frequency couples a later stage's signal current back into an earlier stage, and with gain at that frequency the amplifier oscillates or motor-boats. Holding the rail 40 dB under the smallest load keeps that coupling 40 dB down. Two unequal capacitors resonate in parallel between their self-resonances, where the pair is worse than either alone; an electrolytic is inductive long before HF, and a small ceramic is too high at the low end.",
  fix: "Add the suggested capacitor from the rail to ground, close to the load it serves (short leads: about 1 nH per mm of loop). For an anti-resonance, add a value between the two capacitors or pick values less than a decade apart. For the low end, add or enlarge the bulk electrolytic. Set targetOhms when the default target (from the loads) does not fit the design.",
  references: [
    "Series R-L-C capacitor model, self-resonance f = 1/(2\u03C0\u221A(L\xB7C)): capacitor manufacturers' application notes",
    'D. Brooks, "ESR and bypass capacitor self-resonant behavior - how to select bypass caps", UltraCAD Design, 2000',
    "L. D. Smith et al., target impedance \u0394V/\u0394I, IEEE Transactions on Advanced Packaging, 1999",
    "1/100 of the smallest load (40 dB of stage-to-stage isolation) as the default target: common practice"
  ],
  example: "A 9 V rail with 100 \xB5F, 100 nF and 5 nF (ESL 8, 1.2 and 0.8 nH) feeding a 1.5 k\u03A9 collector load has a 15 \u03A9 default target and passes; fed to a 50 \u03A9 load (target 0.5 \u03A9) it fails at the 100 nF / 5 nF anti-resonance, 0.889 \u03A9 at 52.7 MHz, when the band reaches that high. Add a value between the two (e.g. 22 nF) or choose values closer together."
};
var options6 = {
  targetOhms: {
    type: "number",
    default: 0,
    unit: "ohm",
    description: "Largest |Z| from any rail to ground allowed in the band; 0 derives it from the loads (1/loadRatio of the smallest collector/drain load fed from the rail)."
  },
  loadRatio: {
    type: "number",
    default: 100,
    description: "How many times smaller than the smallest load fed from it the rail's |Z| must stay (100 = 40 dB) when targetOhms is 0."
  }
};
var SOURCE_KINDS = /* @__PURE__ */ new Set(["battery", "voltage-source", "current-source", "power-flag", "connector"]);
function voltsText(rail) {
  return rail.volts === void 0 ? "voltage not stated" : si(rail.volts, "V");
}
function chooseTarget(ctx, rail, configured, ratio) {
  if (configured > 0) return { ohms: configured, basis: `configured target ${si(configured, "\u03A9")}`, isDefault: false };
  const loads = ctx.railLoads(rail.net);
  if (loads.length === 0 || !(ratio > 0)) return void 0;
  const smallest = loads.reduce((a, b) => b.ohms < a.ohms ? b : a);
  const what = smallest.part.kind === "inductor" ? `${smallest.part.ref}'s ${si(smallest.ohms, "\u03A9")} reactance at the band's low edge` : `${smallest.part.ref} ${si(smallest.ohms, "\u03A9")}`;
  const ohms = smallest.ohms / ratio;
  return {
    ohms,
    basis: `default target ${si(ohms, "\u03A9")} (1/${ratio} of the smallest collector/drain load fed from it, ${what} feeding ${smallest.device.ref})`,
    isDefault: true
  };
}
function inBand2(ctx, points) {
  const { low, high } = ctx.band;
  return points.filter((p) => p.hertz >= low * (1 - 1e-9) && p.hertz <= high * (1 + 1e-9));
}
function peaks(ctx, net, points) {
  const out = [];
  for (let i = 1; i < points.length - 1; i++) {
    const prev = points[i - 1];
    const here = points[i];
    const next = points[i + 1];
    if (!prev || !here || !next || !(here.magnitude > prev.magnitude && here.magnitude >= next.magnitude)) continue;
    out.push(refinePeak(ctx, net, prev.hertz, next.hertz) ?? here);
  }
  return out;
}
function refinedWorst(ctx, net, judged) {
  let index = -1;
  judged.forEach((p, i) => {
    if (index < 0 || p.magnitude > (judged[index]?.magnitude ?? 0)) index = i;
  });
  const here = judged[index];
  const prev = judged[index - 1];
  const next = judged[index + 1];
  if (!here || !prev || !next) return here;
  const refined = refinePeak(ctx, net, prev.hertz, next.hertz);
  return refined && refined.magnitude > here.magnitude ? refined : here;
}
function suggestionText(ctx, s, target) {
  if (!s) return "";
  const pkg = s.like ? ` like ${s.like}` : " (0603 ceramic)";
  const outcome = s.worstRatio <= 1 ? `brings the worst in-band |Z| to ${si(s.worstOhms, "\u03A9")}, under the target` : `lowers the worst in-band |Z| to ${si(s.worstOhms, "\u03A9")} at ${si(s.atHertz, "Hz")}, still over ${si(target, "\u03A9")}; more than one part is needed`;
  return ` Adding ${si(s.farads, "F")}${pkg} from the rail to ground (self-resonant at ${si(s.model.srfHertz, "Hz")}) ${outcome}.`;
}
function suggestionData(s) {
  if (!s) return {};
  return { suggestedFarads: s.farads, suggestedSrfHertz: s.model.srfHertz, worstOhmsWithSuggestion: s.worstOhms };
}
function checkRail(ctx, rail, configuredTarget, ratio) {
  const feeds = ctx.partsOn(rail.net).filter(({ part }) => !SOURCE_KINDS.has(part.kind));
  if (feeds.length === 0) return [];
  const caps = [...ctx.groundingCapacitors(rail.net)].sort(byRef);
  const loads = ctx.railLoads(rail.net);
  const anchor = loads[0]?.part ?? feeds[0]?.part;
  const target = chooseTarget(ctx, rail, configuredTarget, ratio);
  const findings = [];
  if (caps.length === 0) {
    findings.push(finding(ctx, ID7, {
      at: anchor,
      severity: "error",
      message: `Rail ${rail.net} (${voltsText(rail)}) has no bypass capacitor to ground: every stage on it shares the supply's impedance. Add a bulk electrolytic and a ceramic (e.g. 100 nF) next to ${anchor?.ref ?? "the load"}.`,
      parts: feeds.map((f) => f.part.ref).filter((r, i, all) => all.indexOf(r) === i).sort((a, b) => a.localeCompare(b, "en", { numeric: true })),
      nets: [rail.net],
      data: { ...rail.volts !== void 0 ? { volts: rail.volts } : {}, capacitors: 0, ...target ? { targetOhms: target.ohms, targetIsDefault: target.isDefault } : {} }
    }));
  }
  const frequencies = ctx.frequencies(40);
  const points = ctx.impedance(rail.net, frequencies, { passiveOnly: true });
  if (!points) {
    ctx.noteLimited(ID7, `no impedance sweep: ${ctx.solverProblem() ?? "the supply network could not be built"}`, caps.map((c) => c.ref));
    return findings;
  }
  const judged = inBand2(ctx, points);
  const worstPoint = refinedWorst(ctx, rail.net, judged);
  if (!target || !worstPoint) {
    if (!target && caps.length > 0) ctx.noteLimited(ID7, `no target for rail ${rail.net}: no collector/drain load found on it (set targetOhms)`, []);
    return findings;
  }
  if (rail.volts !== void 0) ctx.report.addRail({
    net: rail.net,
    volts: rail.volts,
    targetOhms: target.ohms,
    targetBasis: target.basis,
    curve: points.map((p) => [p.hertz, p.magnitude]),
    worst: { ohms: worstPoint.magnitude, hertz: worstPoint.hertz }
  });
  if (caps.length === 0) return findings;
  const limit = () => target.ohms;
  const models = caps.map((part) => ({ part, model: ctx.capacitor(part.ref) })).filter((c) => c.model !== void 0);
  const ceramics = models.filter((m) => m.part.kind === "capacitor");
  const lowestEsl = ceramics.reduce((a, b) => !a || b.model.esl < a.model.esl ? b : a, void 0);
  const largest = models.reduce((a, b) => !a || b.model.farads > a.model.farads ? b : a, void 0);
  const anchorCap = lowestEsl ?? largest;
  const series2 = ctx.config.series.capacitor;
  const judgedHz = judged.map((p) => p.hertz);
  const capParts = caps.map((c) => c.ref);
  const targetPhrase = `the ${target.basis}`;
  const srfs = models.map((m) => ({ part: m.part, srf: m.model.srfHertz, farads: m.model.farads }));
  const highEdge = judged[judged.length - 1];
  const highestSrf = Math.max(...srfs.map((s) => s.srf));
  if (highEdge && srfs.length > 0 && highestSrf < ctx.band.high) {
    const over = highEdge.magnitude > target.ohms;
    const rf = suggestShuntCapacitor(ctx, {
      net: rail.net,
      frequencies: judgedHz,
      limit,
      aimHertz: ctx.band.high,
      like: lowestEsl?.part.ref,
      series: series2
    });
    findings.push(finding(ctx, ID7, {
      at: anchorCap?.part ?? anchor,
      severity: over ? "warning" : "note",
      message: `Rail ${rail.net}: no RF capacitor for the top of the band \u2014 every bypass capacitor is self-resonant below ${si(ctx.band.high, "Hz")} (highest ${si(highestSrf, "Hz")}), so the rail is inductive there: ${si(highEdge.magnitude, "\u03A9")} at ${si(highEdge.hertz, "Hz")}, ${over ? "over" : "still under"} the target ${si(target.ohms, "\u03A9")}.${suggestionText(ctx, rf, target.ohms)}`,
      parts: capParts,
      nets: [rail.net],
      data: { highEdgeOhms: highEdge.magnitude, atHertz: highEdge.hertz, targetOhms: target.ohms, highestSrfHertz: highestSrf, overTarget: over, ...suggestionData(rf) }
    }));
  }
  if (worstPoint.magnitude <= target.ohms) return findings;
  const capacitiveWorst = worstPoint.im < 0;
  const summaryLike = capacitiveWorst ? largest?.part : lowestEsl?.part;
  const summarySuggestion = capacitiveWorst ? suggestShuntCapacitor(
    ctx,
    { net: rail.net, frequencies: judgedHz, limit, aimHertz: worstPoint.hertz, like: summaryLike?.ref, alsoLike: [void 0], series: series2 },
    ctx.snapUp(faradsForReactance(target.ohms, worstPoint.hertz), series2)
  ) : suggestShuntCapacitor(ctx, { net: rail.net, frequencies: judgedHz, limit, aimHertz: worstPoint.hertz, like: summaryLike?.ref, series: series2 });
  findings.push(finding(ctx, ID7, {
    at: anchorCap?.part ?? anchor,
    severity: "warning",
    message: `Rail ${rail.net}: |Z| to ground reaches ${si(worstPoint.magnitude, "\u03A9")} at ${si(worstPoint.hertz, "Hz")}, over ${targetPhrase}, within ${bandText(ctx)}.${suggestionText(ctx, summarySuggestion, target.ohms)}`,
    parts: capParts,
    nets: [rail.net],
    data: {
      ...rail.volts !== void 0 ? { volts: rail.volts } : {},
      worstOhms: worstPoint.magnitude,
      atHertz: worstPoint.hertz,
      targetOhms: target.ohms,
      targetIsDefault: target.isDefault,
      bandIsDefault: ctx.band.isDefault,
      ...suggestionData(summarySuggestion)
    }
  }));
  for (const peak of peaks(ctx, rail.net, points)) {
    if (peak.magnitude <= target.ohms) continue;
    if (peak.hertz < ctx.band.low * (1 - 1e-9) || peak.hertz > ctx.band.high * (1 + 1e-9)) continue;
    const below = srfs.filter((s) => s.srf < peak.hertz).reduce((a, b) => !a || b.srf > a.srf ? b : a, void 0);
    const above = srfs.filter((s) => s.srf > peak.hertz).reduce((a, b) => !a || b.srf < a.srf ? b : a, void 0);
    if (!below || !above) continue;
    const fill = suggestShuntCapacitor(ctx, {
      net: rail.net,
      frequencies: judgedHz,
      limit,
      aimHertz: peak.hertz,
      like: above.part.ref,
      series: series2
    });
    findings.push(finding(ctx, ID7, {
      at: above.part,
      severity: "warning",
      message: `Rail ${rail.net}: ${below.part.ref} (${si(below.farads, "F")}, self-resonant at ${si(below.srf, "Hz")}) and ${above.part.ref} (${si(above.farads, "F")}, ${si(above.srf, "Hz")}) anti-resonate: |Z| peaks at ${si(peak.magnitude, "\u03A9")} at ${si(peak.hertz, "Hz")}, over the target ${si(target.ohms, "\u03A9")}.${suggestionText(ctx, fill, target.ohms)}`,
      parts: [below.part.ref, above.part.ref],
      nets: [rail.net],
      data: {
        peakOhms: peak.magnitude,
        atHertz: peak.hertz,
        targetOhms: target.ohms,
        lowerSrfHertz: below.srf,
        upperSrfHertz: above.srf,
        capacitors: [below.part.ref, above.part.ref],
        ...suggestionData(fill)
      }
    }));
  }
  const lowEdge = judged[0];
  if (lowEdge && lowEdge.magnitude > target.ohms && -lowEdge.im > target.ohms) {
    const neededFarads = faradsForReactance(target.ohms, lowEdge.hertz);
    const bulk = suggestShuntCapacitor(ctx, {
      net: rail.net,
      frequencies: judgedHz,
      limit,
      aimHertz: lowEdge.hertz,
      like: largest?.part.ref,
      alsoLike: [void 0],
      series: series2,
      spanDecades: 1
    }, ctx.snapUp(neededFarads, series2));
    const esrLimited = largest !== void 0 && largest.model.farads >= neededFarads && largest.model.esr > target.ohms;
    const cause = esrLimited && largest ? `${largest.part.ref} (${si(largest.model.farads, "F")}) has capacitance enough, but its ESR of ${si(largest.model.esr, "\u03A9")} (${largest.model.source.includes("from the part's ESR field") ? "from its ESR field" : "estimated for its type and rating; an ESR field overrides it"}) holds |Z| at ${si(lowEdge.magnitude, "\u03A9")} at the band's low edge ${si(lowEdge.hertz, "Hz")}, over the target ${si(target.ohms, "\u03A9")}; use a low-ESR part, give its ESR field if the datasheet's figure is lower, or add a ceramic of at least ${si(neededFarads, "F")} beside it.` : `no bulk capacitance for the low end \u2014 |Z| is ${si(lowEdge.magnitude, "\u03A9")} (capacitive) at the band's low edge ${si(lowEdge.hertz, "Hz")}, over the target ${si(target.ohms, "\u03A9")}; at least ${si(neededFarads, "F")} is needed there.`;
    findings.push(finding(ctx, ID7, {
      at: largest?.part ?? anchor,
      severity: "warning",
      message: `Rail ${rail.net}: ${cause}${suggestionText(ctx, bulk, target.ohms)}`,
      parts: capParts,
      nets: [rail.net],
      data: { lowEdgeOhms: lowEdge.magnitude, atHertz: lowEdge.hertz, targetOhms: target.ohms, neededFarads, esrLimited, ...suggestionData(bulk) }
    }));
  }
  return findings;
}
var railBypass = {
  id: ID7,
  title: "Supply rails are bypassed to ground across the band",
  severity: "warning",
  doc: doc7,
  options: options6,
  tags: ["rf", "supply"],
  check(ctx, opts) {
    const configured = numberOption(opts, "targetOhms", 0);
    const ratio = numberOption(opts, "loadRatio", 100);
    const rails = [...ctx.rails(), ...ctx.unresolvedRails().map((net) => ({ net, volts: void 0 }))];
    return rails.flatMap((rail) => checkRail(ctx, rail, configured, ratio));
  }
};

// rules/ratings.ts
var ID8 = "ratings";
var doc8 = {
  what: "At the DC operating point: every polarized capacitor with + at or above \u2212 (reversed by more than 0.1 V is an error); every capacitor with a voltage rating (Value or Voltage field) inside it, with a warning above the derated figure (80 %) and an error above the rating; every resistor's V\xB2/R inside its power rating (Value or Power field, else by footprint: 0402 1/16 W, 0603 1/10 W, 0805 1/8 W, 1206 1/4 W, through-hole 1/4 W, else 0.1 W assumed), warning above 50 %, error above 100 %; and every transistor's VCE, VCB, IC and dissipation (VDS, ID, dissipation; a JFET's reverse VGS) and every diode's reverse voltage, forward current and zener dissipation against the parts library's absolute maximum ratings, with the same margins.",
  why: "A reversed electrolytic conducts, heats and can vent, and one run near its rated voltage ages fast. A resistor at its full rating runs 70 \xB0C or more above ambient and drifts; a transistor near VCEO or its dissipation limit fails on the first warm day or supply transient. A small-signal simulation shows none of it; the field does.",
  fix: "Turn a reversed electrolytic round (its + toward the higher DC voltage) or use a non-polarized part; choose a capacitor rated well above its DC voltage; use a larger resistor package or a higher resistance, or share the power between two parts; for a transistor, lower the supply or the current, or choose a part with higher ratings. Where the margin is a deliberate choice, set the derating options in loadline.json.",
  references: [
    "Capacitor voltage derated to about 80 %, resistor power to about 50 % of rating: common practice in reliability derating guidelines",
    "Chip resistor power by case size (0402 1/16 W, 0603 1/10 W, 0805 1/8 W, 1206 1/4 W) and 1/4 W through-hole parts: the usual thick-film figures at 70 \xB0C, common practice",
    "Absolute maximum ratings at 25 \xB0C: device datasheets (2N3904 VCEO 40 V, IC 200 mA, 625 mW; 2N7000 VDSS 60 V, 200 mA, 400 mW; J310 V(BR)GSS 25 V; 1N4148 VRRM 100 V, 200 mA), as compiled in the project's reference notes \xA74",
    "Reverse voltage on aluminium electrolytics: at most about 1 V and not continuously (common practice); 0.1 V as the reporting threshold is ours"
  ],
  example: 'A "10u 6.3V" electrolytic across a 9 V rail: an error. A 1 k\u03A9 0603 resistor with 12 V across it takes 144 mW against 1/10 W, an error; in a 1206 (1/4 W) it is a warning at 58 % of the rating.'
};
var options7 = {
  reverseVolts: {
    type: "number",
    default: 0.1,
    unit: "V",
    description: "Reverse DC voltage on a polarized capacitor above which it is reported."
  },
  voltageDerating: {
    type: "number",
    default: 0.8,
    description: "Fraction of a voltage rating (capacitors, transistor and diode voltages) above which a warning is given."
  },
  powerDerating: {
    type: "number",
    default: 0.5,
    description: "Fraction of a power rating (resistors, transistors, zeners) above which a warning is given."
  },
  currentDerating: {
    type: "number",
    default: 0.8,
    description: "Fraction of a current rating (collector, drain, diode forward current) above which a warning is given."
  },
  unknownResistorWatts: {
    type: "number",
    default: 0.1,
    description: "Power rating assumed for a resistor with no rating and no recognised footprint, in watts."
  }
};
var ELECTROLYTIC_CAUTION = "A reversed or over-voltage electrolytic can overheat and vent: correct it before powering the board.";
function judge(value, limit, derating) {
  if (!(limit > 0)) return void 0;
  if (value > limit * (1 + 1e-9)) return "error";
  if (value > limit * derating * (1 + 1e-9)) return "warning";
  return void 0;
}
function percentOf(value, limit) {
  return `${Math.round(value / limit * 100)} %`;
}
function twoNets(part, first, second) {
  const a = part.pins[part.roles[first] ?? ""];
  const b = part.pins[part.roles[second] ?? ""];
  return a !== void 0 && b !== void 0 ? [a, b] : void 0;
}
function capacitorFindings(ctx, part, reverseVolts, derating) {
  const polarized = part.kind === "polarized-capacitor";
  const nets = polarized ? twoNets(part, "+", "-") : twoNets(part, "1", "2");
  if (!nets) return [];
  const va = ctx.voltage(nets[0]);
  const vb = ctx.voltage(nets[1]);
  if (va === void 0 || vb === void 0) return [];
  const across = va - vb;
  const out = [];
  if (polarized && across < -reverseVolts) {
    out.push(finding(ctx, ID8, {
      at: part,
      severity: "error",
      message: `${part.ref} (${part.value}) is reverse-biased at the operating point: its + terminal (${nets[0]}, ${si(va, "V")}) is ${si(-across, "V")} below its \u2212 terminal (${nets[1]}, ${si(vb, "V")}). Turn it round or use a non-polarized capacitor. ${ELECTROLYTIC_CAUTION}`,
      parts: [part.ref],
      nets,
      data: { reverseVolts: -across, plusVolts: va, minusVolts: vb, thresholdVolts: reverseVolts }
    }));
  }
  const rating = part.parsed.voltageRating;
  if (rating !== void 0) {
    const level = judge(Math.abs(across), rating, derating.voltage);
    if (level) {
      const caution = polarized ? ` ${ELECTROLYTIC_CAUTION}` : "";
      out.push(finding(ctx, ID8, {
        at: part,
        severity: level,
        message: `${part.ref} (${part.value}) has ${si(Math.abs(across), "V")} DC across it, ${percentOf(Math.abs(across), rating)} of its ${si(rating, "V")} rating${level === "error" ? ", beyond it" : `, above the ${Math.round(derating.voltage * 100)} % derating`}. Use a part rated for at least ${si(Math.abs(across) / derating.voltage, "V")}.${caution}`,
        parts: [part.ref],
        nets,
        data: { volts: Math.abs(across), ratedVolts: rating, derating: derating.voltage, fraction: Math.abs(across) / rating }
      }));
    }
  }
  return out;
}
function resistorFinding(ctx, part, derating, unknownWatts) {
  const watts = ctx.dissipation(part.ref);
  const rating = ctx.resistorPowerRating(part.ref, unknownWatts);
  if (watts === void 0 || !rating) return void 0;
  const level = judge(watts, rating.watts, derating.power);
  if (!level) return void 0;
  const needed = watts / derating.power;
  return finding(ctx, ID8, {
    at: part,
    severity: level,
    message: `${part.ref} (${part.value}) dissipates ${si(watts, "W")} at the operating point, ${percentOf(watts, rating.watts)} of its ${si(rating.watts, "W")} rating (${rating.basis})${level === "error" ? ", beyond its rating" : `, above the ${Math.round(derating.power * 100)} % derating`}. Use a part rated for at least ${si(needed, "W")} (a larger package), or a higher resistance if the circuit allows.`,
    parts: [part.ref],
    nets: Object.values(part.pins),
    data: { watts, ratedWatts: rating.watts, ratingAssumed: rating.assumed, derating: derating.power, fraction: watts / rating.watts, ratingBasis: rating.basis }
  });
}
function deviceChecks(device, r, totalPower, d, part) {
  switch (device.kind) {
    case "bjt":
      return [
        { what: "VCE", value: device.vce, limit: r.vceo, derating: d.voltage, unit: "V", key: "vce" },
        { what: "VCB", value: device.vcb, limit: r.vcbo, derating: d.voltage, unit: "V", key: "vcb" },
        { what: "reverse VBE", value: -device.vbe, limit: r.vebo, derating: d.voltage, unit: "V", key: "vebReverse" },
        { what: "IC", value: device.ic, limit: r.icMax, derating: d.current, unit: "A", key: "ic" },
        { what: "dissipation", value: totalPower, limit: r.ptot, derating: d.power, unit: "W", key: "watts" }
      ];
    case "jfet":
      return [
        { what: "VDS", value: Math.abs(device.vds), limit: r.vds, derating: d.voltage, unit: "V", key: "vds" },
        { what: "reverse VGS", value: -device.vgs, limit: r.vgsMax, derating: d.voltage, unit: "V", key: "vgsReverse" },
        { what: "ID", value: device.id, limit: r.idMax, derating: d.current, unit: "A", key: "id" },
        { what: "gate current", value: device.ig, limit: r.igMax, derating: d.current, unit: "A", key: "ig" },
        { what: "dissipation", value: totalPower, limit: r.ptot, derating: d.power, unit: "W", key: "watts" }
      ];
    case "mosfet":
      return [
        { what: part.kind === "dual-gate-mosfet" ? "VDS (both channels)" : "VDS", value: Math.abs(device.vds), limit: r.vds, derating: d.voltage, unit: "V", key: "vds" },
        { what: "ID", value: device.id, limit: r.idMax, derating: d.current, unit: "A", key: "id" },
        { what: "dissipation", value: totalPower, limit: r.ptot, derating: d.power, unit: "W", key: "watts" }
      ];
    case "diode": {
      const zener = part.kind === "zener";
      return [
        ...zener ? [] : [{ what: "reverse voltage", value: -device.vd, limit: r.vrrm, derating: d.voltage, unit: "V", key: "vReverse" }],
        { what: "forward current", value: device.id, limit: r.ifMax, derating: d.current, unit: "A", key: "ifwd" },
        { what: "dissipation", value: totalPower, limit: r.ptot, derating: d.power, unit: "W", key: "watts" }
      ];
    }
  }
}
function wholeDevice(ctx, part) {
  if (part.kind !== "dual-gate-mosfet") return ctx.device(part.ref);
  const top = ctx.device(part.ref, "g2");
  const drain = ctx.netOf(part.ref, "D");
  const source = ctx.netOf(part.ref, "S");
  const vd = drain === void 0 ? void 0 : ctx.voltage(drain);
  const vs = source === void 0 ? void 0 : ctx.voltage(source);
  if (!top || top.kind !== "mosfet" || vd === void 0 || vs === void 0) return void 0;
  return { ...top, vds: vd - vs };
}
function deviceFindings(ctx, part, derating) {
  const ratings2 = ctx.rating(part.ref);
  const device = wholeDevice(ctx, part);
  if (!ratings2 || !device) return [];
  const power = ctx.dissipation(part.ref) ?? device.power;
  const out = [];
  for (const check of deviceChecks(device, ratings2, power, derating, part)) {
    if (check.limit === void 0) continue;
    const level = judge(check.value, check.limit, check.derating);
    if (!level) continue;
    const data = { [check.key]: check.value, limit: check.limit, derating: check.derating, fraction: check.value / check.limit, ratingSource: ratings2.source };
    out.push(finding(ctx, ID8, {
      at: part,
      severity: level,
      message: `${part.ref} (${part.value}) runs at ${check.what} ${si(check.value, check.unit)} at the operating point, ${percentOf(check.value, check.limit)} of its ${si(check.limit, check.unit)} absolute maximum${level === "error" ? ", beyond it" : `, above the ${Math.round(check.derating * 100)} % derating`} (the parts library's 25 \xB0C rating). Lower the ${check.unit === "W" ? "supply or the current" : check.unit === "A" ? "current" : "voltage"} or choose a part with higher ratings.`,
      parts: [part.ref],
      nets: Object.values(part.pins),
      data
    }));
  }
  return out;
}
var DEVICE_KINDS = /* @__PURE__ */ new Set(["npn", "pnp", "njfet", "pjfet", "nmos", "pmos", "dual-gate-mosfet", "diode", "zener"]);
var ratings = {
  id: ID8,
  title: "Parts stay inside their ratings at the operating point",
  severity: "warning",
  doc: doc8,
  options: options7,
  tags: ["ratings", "reliability"],
  check(ctx, opts) {
    const derating = {
      voltage: numberOption(opts, "voltageDerating", 0.8),
      power: numberOption(opts, "powerDerating", 0.5),
      current: numberOption(opts, "currentDerating", 0.8)
    };
    const reverseVolts = numberOption(opts, "reverseVolts", 0.1);
    const unknownWatts = numberOption(opts, "unknownResistorWatts", 0.1);
    const parts = ctx.circuit.parts.filter((p) => !p.dnp).sort(byRef);
    if (!ctx.operatingPoint()) {
      const checked = parts.filter((p) => p.kind === "polarized-capacitor" || p.kind === "resistor" || DEVICE_KINDS.has(p.kind));
      if (checked.length > 0) ctx.noteLimited(ID8, `no operating point (${ctx.operatingPointProblem() ?? "not solved"}): ratings not checked`, checked.map((p) => p.ref));
      return [];
    }
    const findings = [];
    const unrated = [];
    for (const part of parts) {
      if (part.kind === "capacitor" || part.kind === "polarized-capacitor") findings.push(...capacitorFindings(ctx, part, reverseVolts, derating));
      else if (part.kind === "resistor") {
        const f = resistorFinding(ctx, part, derating, unknownWatts);
        if (f) findings.push(f);
      } else if (DEVICE_KINDS.has(part.kind)) {
        if (!ctx.rating(part.ref) && ctx.device(part.ref) !== void 0) unrated.push(part.ref);
        findings.push(...deviceFindings(ctx, part, derating));
      }
    }
    if (unrated.length > 0) ctx.noteLimited(ID8, "no absolute maximum ratings known for parts outside the built-in library: device limits not checked", unrated);
    return findings;
  }
};

// rules/stack-headroom.ts
var ID9 = "stack-headroom";
var doc9 = {
  what: "For every stack of devices in series from a rail (cascodes, totem-pole bias stacks, and the two channels of every dual-gate MOSFET), computes each device's headroom at the operating point \u2014 VCE \u2212 VCE(sat) (the part's rated VCE(sat), else 0.2 V), or VDS \u2212 VDS(sat) with VDS(sat) = VGS \u2212 VTO (JFET) or VGS \u2212 VTH (MOSFET) \u2014 and the largest undistorted peak swing at the stack's output: toward the devices, until the first reaches its saturation edge while carrying its small-signal share of the swing (nearly all across the output device in a cascode), away from them the DC drop across a resistive load (a choke sets no limit). Compares each with the configured signal swing and gives the supply the stack would need at the same currents.",
  why: "A stack spends voltage: each device needs its saturation voltage plus the swing, and the load needs the swing again. On a low rail the top device saturates on the signal's negative peaks, or the load cuts off on the positive ones, while the small-signal gain looks fine: the stage clips, intermodulation rises, and strong signals produce spurious responses.",
  fix: 'Raise the rail toward the supply given, move the bias so the short device gets the volts (a lower divider tap for the upper base, a smaller emitter or source resistor), use a smaller collector resistor or a choke load, or set "swing" in loadline.json to the peak swing the stage really carries.',
  references: [
    "Cascode output swing bounded by the upper device's saturation and by the load: P. R. Gray and R. G. Meyer, Analysis and Design of Analog Integrated Circuits",
    "Cascode and output swing: A. S. Sedra and K. C. Smith, Microelectronic Circuits",
    "VDS(sat) = VGS \u2212 VTO at the edge of pinch-off: the Shichman\u2013Hodges (square-law) FET model",
    "VCE(sat) 0.2 V where the part has no rating: the small-signal datasheet figure at IC 10 mA, IB 1 mA (2N3904 class), common practice"
  ],
  example: "9 V cascode, divider 12 k/5.6 k/6.8 k, RE 1 k, RC 1.5 k\u03A9, 2N3904: VCE1 2.05 V, VCE2 2.66 V, headrooms 1.85 V and 2.46 V; Q2 carries 99 % of the swing. The output swings 2.49 V down and 2.56 V up, so 2.49 V peak at most; with swing 3 V the rule warns that about 9.95 V would be needed."
};
function isNType(part) {
  return part.kind === "npn" || part.kind === "njfet" || part.kind === "nmos" || part.kind === "dual-gate-mosfet";
}
function stacksToCheck(ctx) {
  const out = ctx.stacks().map((s) => ({ ...s, tetrode: false }));
  const inStacks = new Set(out.flatMap((s) => s.refs));
  for (const device of ctx.devices()) {
    if (device.kind !== "dual-gate-mosfet" || inStacks.has(device.ref)) continue;
    const drain = netOfRole(device, "D");
    const path = drain === void 0 ? void 0 : ctx.supplyPath(drain);
    out.push({ refs: [device.ref], rail: path?.rail ?? "", loads: path?.parts.map((p) => p.ref) ?? [], tetrode: true });
  }
  return out;
}
function positionsOf(ctx, stack) {
  const positions = [];
  const missing = [];
  for (const ref of stack.refs) {
    const part = ctx.part(ref);
    if (!part) continue;
    const channels = part.kind === "dual-gate-mosfet" ? ["g1", "g2"] : [void 0];
    for (const channel2 of channels) {
      const device = ctx.device(ref, channel2);
      const edge = ctx.saturationEdge(ref, channel2);
      if (!device || !edge || device.kind === "diode") {
        missing.push(ref);
        continue;
      }
      const volts = device.kind === "bjt" ? device.vce : device.vds;
      const label = channel2 ? `${ref} (gate-${channel2 === "g1" ? "1" : "2"} channel)` : ref;
      const t = terminalsOf(part.kind);
      const topNet = channel2 === "g1" ? void 0 : t ? netOfRole(part, t.top) : void 0;
      const bottomNet = channel2 === "g2" ? void 0 : t ? netOfRole(part, t.bottom) : void 0;
      positions.push({
        part,
        label,
        ...channel2 ? { channel: channel2 } : {},
        volts,
        satVolts: edge.volts,
        satBasis: edge.basis,
        voltsLabel: device.kind === "bjt" ? "VCE" : "VDS",
        ...topNet !== void 0 ? { topNet } : {},
        ...bottomNet !== void 0 ? { bottomNet } : {}
      });
    }
  }
  return { positions, missing: [...new Set(missing)] };
}
var stackHeadroom = {
  id: ID9,
  title: "Stacked devices keep headroom for the signal swing",
  severity: "warning",
  doc: doc9,
  options: {},
  tags: ["bias", "headroom"],
  check(ctx) {
    const stacks = stacksToCheck(ctx);
    if (stacks.length === 0) return [];
    if (!ctx.operatingPoint()) {
      ctx.noteLimited(ID9, `no operating point (${ctx.operatingPointProblem() ?? "not solved"}): stack headroom not computed`, stacks.flatMap((s) => s.refs));
      return [];
    }
    const swing = ctx.config.swing.volts;
    const swingText = ctx.config.swing.isDefault ? `${si(swing, "V")} peak (the default; set "swing" in loadline.json)` : `${si(swing, "V")} peak`;
    const findings = [];
    for (const stack of stacks) {
      const { positions, missing } = positionsOf(ctx, stack);
      if (missing.length > 0 || positions.length === 0) {
        ctx.noteLimited(ID9, "a device of the stack has no operating point", missing.length > 0 ? missing : stack.refs);
        continue;
      }
      const bottomPart = positions[0]?.part;
      const topPart = positions[positions.length - 1]?.part;
      if (!bottomPart || !topPart) continue;
      const nType = isNType(topPart);
      const outputPart = nType ? topPart : bottomPart;
      const outputPosition = nType ? positions[positions.length - 1] : positions[0];
      const outputNet = netOfRole(outputPart, terminalsOf(outputPart.kind)?.output ?? "");
      const outputVolts = outputNet === void 0 ? void 0 : ctx.voltage(outputNet);
      const railVolts = stack.rail === "" ? void 0 : ctx.rail(stack.rail)?.volts ?? ctx.voltage(stack.rail);
      const firstLoad = stack.loads[0] === void 0 ? void 0 : ctx.part(stack.loads[0]);
      const headrooms = positions.map((p) => p.volts - p.satVolts);
      const controlNet = netOfRole(bottomPart, terminalsOf(bottomPart.kind)?.control ?? "");
      const shares = swingShares(ctx, positions, nType ? positions.length - 1 : 0, controlNet, outputNet);
      const limits = positions.map((_, i) => {
        const share = shares.values[i] ?? 1;
        return share > 1e-6 ? (headrooms[i] ?? 0) / share : Number.POSITIVE_INFINITY;
      });
      const towardDevices = Math.min(...limits);
      const limiting = positions[limits.indexOf(towardDevices)] ?? outputPosition;
      let towardLoad;
      let loadText;
      if (nType && firstLoad?.kind === "resistor" && railVolts !== void 0 && outputVolts !== void 0) {
        towardLoad = railVolts - outputVolts;
        loadText = `${si(towardLoad, "V")} up before ${outputPart.ref} cuts off (the DC drop across ${firstLoad.ref})`;
      } else if (nType && firstLoad?.kind === "inductor") {
        towardLoad = Number.POSITIVE_INFINITY;
        loadText = `above the rail on the positive peaks (choke load ${firstLoad.ref}: no limit from the load)`;
      } else {
        towardLoad = void 0;
        loadText = "the load-side limit was not computed (no resistive load from the output to the rail found)";
      }
      const maxSwing = Math.min(towardDevices, towardLoad ?? Number.POSITIVE_INFINITY);
      const saturated = positions.filter((_, i) => (headrooms[i] ?? 0) <= 0);
      if (saturated.length === 0 && maxSwing >= swing) continue;
      const short = positions.filter((_, i) => (headrooms[i] ?? 0) < (shares.values[i] ?? 1) * swing);
      const deficit = positions.reduce((sum, _, i) => sum + Math.max(0, (shares.values[i] ?? 1) * swing - (headrooms[i] ?? 0)), 0) + (towardLoad !== void 0 && Number.isFinite(towardLoad) ? Math.max(0, swing - towardLoad) : 0);
      const supplyNeeded = railVolts !== void 0 ? railVolts + deficit : void 0;
      const name = stack.tetrode ? `${stack.refs[0] ?? ""} (a dual-gate MOSFET: two channels in series)` : `the stack ${[...stack.refs].reverse().join(" over ")}`;
      const headroomText = positions.map((p, i) => {
        const share = shares.values[i] ?? 1;
        const carries = share < 0.99 ? ` (it carries ${Number((share * 100).toPrecision(2))} % of the output swing)` : "";
        return `${p.label} ${p.voltsLabel} ${si(p.volts, "V")} \u2212 ${si(p.satVolts, "V")} = ${si(headrooms[i] ?? 0, "V")}${carries}`;
      }).join(", ");
      const direction = nType ? "down" : "up";
      const swingDirections = nType ? `its output ${outputNet ?? "?"} can swing ${si(towardDevices, "V")} ${direction} before ${limiting?.label ?? "a device"} saturates and ${loadText}` : `its output ${outputNet ?? "?"} can swing ${si(towardDevices, "V")} ${direction} before ${limiting?.label ?? "a device"} saturates`;
      const supplyText = supplyNeeded !== void 0 && deficit > 0 ? ` At the same currents, with the extra volts where they are short, it would need about ${si(supplyNeeded, "V")} instead of ${si(railVolts ?? 0, "V")}.` : "";
      const severe = saturated.length > 0;
      findings.push(finding(ctx, ID9, {
        at: outputPart,
        severity: severe ? "error" : "warning",
        message: `${capitalise2(name)} from ${stack.rail || "its supply"}: headroom ${headroomText}${severe ? ` \u2014 ${saturated.map((p) => p.label).join(", ")} already at or below the saturation edge, not amplifying` : ""}. ${capitalise2(swingDirections)}, so ${si(Math.max(0, maxSwing), "V")} peak at most undistorted, against a swing of ${swingText}.${supplyText}${shares.basis}`,
        parts: [...stack.refs, ...stack.loads],
        nets: [...outputNet !== void 0 ? [outputNet] : [], ...stack.rail ? [stack.rail] : []],
        data: {
          devices: positions.map((p) => p.label),
          volts: positions.map((p) => p.volts),
          satVolts: positions.map((p) => p.satVolts),
          headroomVolts: headrooms,
          swingShare: shares.values,
          satBasis: positions.map((p) => p.satBasis),
          towardDevicesVolts: towardDevices,
          ...towardLoad !== void 0 && Number.isFinite(towardLoad) ? { towardLoadVolts: towardLoad } : {},
          maxSwingVolts: maxSwing,
          swingVolts: swing,
          ...railVolts !== void 0 ? { railVolts } : {},
          ...supplyNeeded !== void 0 ? { supplyNeededVolts: supplyNeeded } : {},
          shortDevices: short.map((p) => p.label)
        }
      }));
    }
    return findings;
  }
};
function swingShares(ctx, positions, outputIndex, inputNet, outputNet) {
  const ones = positions.map(() => 1);
  if (inputNet === void 0 || outputNet === void 0 || ctx.isSupply(inputNet)) {
    return { values: ones, basis: " (Each device is held to the whole swing: the stack's input could not be driven for the small-signal shares.)" };
  }
  const hertz = Math.sqrt(ctx.band.low * ctx.band.high);
  const at = (net) => {
    if (net === void 0) return void 0;
    if (ctx.isSupply(net)) return { re: 0, im: 0 };
    const point = ctx.transfer(inputNet, net, [hertz])?.[0];
    return point && Number.isFinite(point.re) && Number.isFinite(point.im) ? { re: point.re, im: point.im } : void 0;
  };
  const out = at(outputNet);
  const outMagnitude = out ? Math.hypot(out.re, out.im) : 0;
  if (!out || !(outMagnitude > 1e-9)) {
    return { values: ones, basis: " (Each device is held to the whole swing: no small-signal transfer to the output was found.)" };
  }
  let unknown = false;
  const values = positions.map((p, i) => {
    const top = at(p.topNet);
    const bottom = at(p.bottomNet);
    if (!top || !bottom) {
      if (i !== outputIndex) unknown = true;
      return 1;
    }
    return Math.hypot(top.re - bottom.re, top.im - bottom.im) / outMagnitude;
  });
  return { values, basis: unknown ? " (A device whose terminals are not both nets \u2014 a dual-gate channel \u2014 is held to the whole swing.)" : "" };
}
function capitalise2(s) {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

// rules/index.ts
var allRules = [
  railBypass,
  baseAcGround,
  gateProtection,
  eSeries,
  stackHeadroom,
  biasCentre,
  cornerFrequency,
  ratings,
  modelCoverage
];

// src/engine/config.ts
import { dirname as dirname4, join as join3, resolve } from "node:path";

// src/engine/rule.ts
var UNIT_ALIASES = {
  hz: "Hz",
  hertz: "Hz",
  "\u03C9": "\u03A9",
  ohm: "\u03A9",
  ohms: "\u03A9",
  v: "V",
  volt: "V",
  volts: "V",
  a: "A",
  amp: "A",
  ampere: "A",
  amperes: "A",
  f: "F",
  farad: "F",
  farads: "F",
  h: "H",
  henry: "H",
  henries: "H"
};
function quantityUnit(unit) {
  if (unit === void 0) return void 0;
  return UNIT_ALIASES[unit.trim().toLowerCase()];
}
var UNIT_NOUN = {
  Hz: "a frequency",
  "\u03A9": "a resistance",
  V: "a voltage",
  A: "a current",
  F: "a capacitance",
  H: "an inductance"
};
function unitNoun(unit) {
  return UNIT_NOUN[unit];
}
function checkRuleOption(option, value) {
  switch (option.type) {
    case "number": {
      const unit = quantityUnit(option.unit);
      if (typeof value === "number" && Number.isFinite(value)) return { ok: true, value };
      if (typeof value === "string" && unit !== void 0) {
        const parsed = parseQuantity(value, unit);
        if (typeof parsed === "number") return { ok: true, value: parsed };
        return { ok: false, expected: `${unitNoun(unit)} such as ${exampleOf(option)}` };
      }
      return { ok: false, expected: unit ? `${unitNoun(unit)} such as ${exampleOf(option)}` : "a number" };
    }
    case "string":
      if (typeof value !== "string") return { ok: false, expected: expectedString(option) };
      if (option.enum && !option.enum.includes(value)) return { ok: false, expected: expectedString(option) };
      return { ok: true, value };
    case "boolean":
      return typeof value === "boolean" ? { ok: true, value } : { ok: false, expected: "true or false" };
    case "string[]":
      if (!Array.isArray(value) || !value.every((item) => typeof item === "string")) {
        return { ok: false, expected: "a list of strings" };
      }
      if (option.enum) {
        const allowed = option.enum;
        if (!value.every((item) => allowed.includes(item))) {
          return { ok: false, expected: `a list of ${allowed.map((e) => `'${e}'`).join(", ")}` };
        }
      }
      return { ok: true, value: [...value] };
  }
}
function expectedString(option) {
  return option.enum ? `one of ${option.enum.map((e) => `'${e}'`).join(", ")}` : "a string";
}
function exampleOf(option) {
  if (typeof option.default === "string") return `'${option.default}'`;
  return option.unit ? `'${String(option.default)} ${option.unit}'` : `'${String(option.default)}'`;
}
function resolveRuleOptions(rule, configured = {}) {
  const resolved = {};
  for (const [name, option] of Object.entries(rule.options)) {
    const fallback = checkRuleOption(option, option.default);
    const defaultValue = fallback.ok ? fallback.value : option.default;
    if (Object.hasOwn(configured, name)) {
      const checked = checkRuleOption(option, configured[name]);
      resolved[name] = checked.ok ? checked.value : defaultValue;
    } else {
      resolved[name] = defaultValue;
    }
  }
  return resolved;
}

// src/engine/json-positions.ts
var MAX_DEPTH = 64;
var Failure = class {
  constructor(offset, message) {
    this.offset = offset;
    this.message = message;
  }
  offset;
  message;
};
function parseJsonWithPositions(source) {
  const text = source.startsWith("\uFEFF") ? source.slice(1) : source;
  const lineStarts = [0];
  for (let i2 = 0; i2 < text.length; i2++) if (text.charCodeAt(i2) === 10) lineStarts.push(i2 + 1);
  const positionOf = (offset) => {
    let lo = 0;
    let hi = lineStarts.length - 1;
    while (lo < hi) {
      const mid = lo + hi + 1 >> 1;
      if ((lineStarts[mid] ?? 0) <= offset) lo = mid;
      else hi = mid - 1;
    }
    return { line: lo + 1, column: offset - (lineStarts[lo] ?? 0) + 1 };
  };
  let i = 0;
  const fail = (message, at = i) => {
    throw new Failure(at, message);
  };
  const describe2 = (at) => at >= text.length ? "end of file" : `'${text[at]}'`;
  const skipSpace = () => {
    while (i < text.length) {
      const c = text[i];
      if (c === " " || c === "	" || c === "\n" || c === "\r") i++;
      else if (c === "/" && (text[i + 1] === "/" || text[i + 1] === "*")) {
        fail("comments are not allowed in JSON");
      } else break;
    }
  };
  const readString = () => {
    const start = i;
    i++;
    let out = "";
    while (true) {
      if (i >= text.length) fail("unterminated string", start);
      const c = text[i];
      const code = c.charCodeAt(0);
      if (c === '"') {
        i++;
        return out;
      }
      if (code < 32) fail("control character in string (write it as an escape such as \\n)");
      if (c === "\\") {
        const e = text[i + 1];
        const simple = { '"': '"', "\\": "\\", "/": "/", b: "\b", f: "\f", n: "\n", r: "\r", t: "	" };
        if (e !== void 0 && simple[e] !== void 0) {
          out += simple[e];
          i += 2;
        } else if (e === "u") {
          const hex = text.slice(i + 2, i + 6);
          if (!/^[0-9a-fA-F]{4}$/.test(hex)) fail("expected four hex digits after \\u");
          out += String.fromCharCode(parseInt(hex, 16));
          i += 6;
        } else {
          fail(`unknown escape '\\${e ?? ""}' in string`);
        }
      } else {
        out += c;
        i++;
      }
    }
  };
  const readNumber = () => {
    const match = /^-?(0|[1-9][0-9]*)(\.[0-9]+)?([eE][+-]?[0-9]+)?/.exec(text.slice(i, i + 400));
    if (!match) return fail(`expected a value but found ${describe2(i)}`);
    i += match[0].length;
    return Number(match[0]);
  };
  const readValue = (depth) => {
    if (depth > MAX_DEPTH) fail(`nesting deeper than ${MAX_DEPTH} levels`);
    skipSpace();
    const pos = positionOf(i);
    const c = text[i];
    if (c === "{") {
      i++;
      const entries = [];
      const seen = /* @__PURE__ */ new Set();
      skipSpace();
      if (text[i] === "}") {
        i++;
        return { kind: "object", pos, entries };
      }
      while (true) {
        skipSpace();
        if (text[i] !== '"') fail(`expected a key in double quotes but found ${describe2(i)}`);
        const keyOffset = i;
        const key = readString();
        if (seen.has(key)) fail(`key '${key}' appears twice`, keyOffset);
        seen.add(key);
        skipSpace();
        if (text[i] !== ":") fail(`expected ':' after key '${key}' but found ${describe2(i)}`);
        i++;
        const value = readValue(depth + 1);
        entries.push({ key, keyPos: positionOf(keyOffset), value });
        skipSpace();
        if (text[i] === ",") {
          i++;
          skipSpace();
          if (text[i] === "}") fail("trailing comma before '}'");
          continue;
        }
        if (text[i] === "}") {
          i++;
          return { kind: "object", pos, entries };
        }
        fail(`expected ',' or '}' but found ${describe2(i)}`);
      }
    }
    if (c === "[") {
      i++;
      const items = [];
      skipSpace();
      if (text[i] === "]") {
        i++;
        return { kind: "array", pos, items };
      }
      while (true) {
        items.push(readValue(depth + 1));
        skipSpace();
        if (text[i] === ",") {
          i++;
          skipSpace();
          if (text[i] === "]") fail("trailing comma before ']'");
          continue;
        }
        if (text[i] === "]") {
          i++;
          return { kind: "array", pos, items };
        }
        fail(`expected ',' or ']' but found ${describe2(i)}`);
      }
    }
    if (c === '"') return { kind: "string", pos, value: readString() };
    if (text.startsWith("true", i)) {
      i += 4;
      return { kind: "boolean", pos, value: true };
    }
    if (text.startsWith("false", i)) {
      i += 5;
      return { kind: "boolean", pos, value: false };
    }
    if (text.startsWith("null", i)) {
      i += 4;
      return { kind: "null", pos };
    }
    if (c === "-" || c !== void 0 && c >= "0" && c <= "9") return { kind: "number", pos, value: readNumber() };
    return fail(`expected a value but found ${describe2(i)}`);
  };
  try {
    const node = readValue(0);
    skipSpace();
    if (i < text.length) fail(`unexpected ${describe2(i)} after the end of the JSON value`);
    return { ok: true, node };
  } catch (err) {
    if (err instanceof Failure) {
      return { ok: false, error: { ...positionOf(err.offset), message: err.message } };
    }
    throw err;
  }
}
function plainValue(node) {
  switch (node.kind) {
    case "object": {
      const out = {};
      for (const entry of node.entries) out[entry.key] = plainValue(entry.value);
      return out;
    }
    case "array":
      return node.items.map(plainValue);
    case "null":
      return null;
    default:
      return node.value;
  }
}

// src/engine/config.ts
var CONFIG_FILE_NAME = "loadline.json";
var E_SERIES2 = ["E3", "E6", "E12", "E24", "E48", "E96", "E192"];
var RULE_LEVELS = ["off", "error", "warning", "note"];
var DEFAULTS = {
  band: { low: 5e5, high: 3e7 },
  swingVolts: 1,
  series: { resistor: "E24", capacitor: "E12", inductor: "E12", capacitorCheck: false }
};
var TOP_KEYS = ["band", "rails", "swing", "rules", "ignore", "models", "series"];
var SERIES_KEYS = ["resistor", "capacitor", "inductor", "capacitorCheck"];
function defaultConfig() {
  return {
    band: { low: DEFAULTS.band.low, high: DEFAULTS.band.high, isDefault: true },
    rails: {},
    swing: { volts: DEFAULTS.swingVolts, isDefault: true },
    rules: {},
    ignore: [],
    series: { ...DEFAULTS.series },
    defaulted: ["band", "swing", "series.resistor", "series.capacitor", "series.inductor", "series.capacitorCheck"]
  };
}
function loadConfig(text, file, knownRules) {
  const config = defaultConfig();
  config.file = file;
  const errors = [];
  const report = (pos, message) => {
    errors.push({ file, line: pos.line, column: pos.column, message });
  };
  const parsed = parseJsonWithPositions(text);
  if (!parsed.ok) {
    errors.push({ file, line: parsed.error.line, column: parsed.error.column, message: `not valid JSON: ${parsed.error.message}` });
    return { config, errors };
  }
  const root = parsed.node;
  if (root.kind !== "object") {
    report(root.pos, `expected an object ({ \u2026 }) at the top, found ${kindNoun(root)}`);
    return { config, errors };
  }
  const defaulted = new Set(config.defaulted);
  for (const entry of root.entries) {
    const { key, value } = entry;
    switch (key) {
      case "$schema":
        if (value.kind !== "string") report(value.pos, `'$schema' must be a string, found ${kindNoun(value)}`);
        break;
      case "band":
        if (readBand(value, config, report)) defaulted.delete("band");
        break;
      case "rails":
        readRails(value, config, report);
        break;
      case "swing": {
        const volts = readQuantity(value, "V", "swing", report);
        if (volts !== void 0) {
          if (volts <= 0) report(value.pos, `swing: must be above 0 V (it is the peak signal swing)`);
          else {
            config.swing = { volts, isDefault: false };
            defaulted.delete("swing");
          }
        }
        break;
      }
      case "rules":
        readRules(value, config, knownRules, report);
        break;
      case "ignore":
        if (value.kind !== "array" || !value.items.every((item) => item.kind === "string")) {
          report(value.pos, `ignore: expected a list of path globs such as ["legacy/**", "*-old.kicad_sch"]`);
        } else {
          config.ignore = value.items.map((item) => String(plainValue(item)));
        }
        break;
      case "models":
        if (value.kind !== "string" || value.value.trim() === "") {
          report(value.pos, `models: expected the path of a SPICE model library such as "models/front-end.lib"`);
        } else {
          config.models = value.value;
        }
        break;
      case "series":
        readSeries(value, config, defaulted, report);
        break;
      default:
        report(entry.keyPos, `unknown key '${key}'${suggest(key, TOP_KEYS)}; known keys: ${TOP_KEYS.join(", ")}`);
    }
  }
  config.defaulted = [...defaulted];
  return { config, errors };
}
function kindNoun(node) {
  switch (node.kind) {
    case "object":
      return "an object";
    case "array":
      return "a list";
    case "string":
      return `the string '${node.value}'`;
    case "number":
      return `the number ${node.value}`;
    case "boolean":
      return String(node.value);
    case "null":
      return "null";
  }
}
var UNIT_NOUN2 = { Hz: "frequency", V: "voltage" };
var UNIT_EXAMPLE = { Hz: '"1.8MHz"', V: '"12V"' };
function readQuantity(node, unit, key, report) {
  if (node.kind === "number") return node.value;
  if (node.kind !== "string") {
    report(node.pos, `${key}: expected a ${UNIT_NOUN2[unit]} such as ${UNIT_EXAMPLE[unit]}, found ${kindNoun(node)}`);
    return void 0;
  }
  const parsed = parseQuantity(node.value, unit);
  if (typeof parsed === "number") return parsed;
  report(node.pos, `${key}: '${node.value}' is not a ${UNIT_NOUN2[unit]}; write it like ${UNIT_EXAMPLE[unit]}`);
  return void 0;
}
function readBand(node, config, report) {
  if (node.kind !== "object") {
    report(node.pos, `band: expected { "low": "1.8MHz", "high": "30MHz" }, found ${kindNoun(node)}`);
    return false;
  }
  let low;
  let high;
  let lowPos = node.pos;
  let highPos = node.pos;
  for (const entry of node.entries) {
    if (entry.key === "low") {
      low = readQuantity(entry.value, "Hz", "band.low", report);
      lowPos = entry.value.pos;
    } else if (entry.key === "high") {
      high = readQuantity(entry.value, "Hz", "band.high", report);
      highPos = entry.value.pos;
    } else {
      report(entry.keyPos, `unknown key 'band.${entry.key}'${suggest(entry.key, ["low", "high"])}; known keys: low, high`);
    }
  }
  const has = (key) => node.entries.some((e) => e.key === key);
  if (!has("low") || !has("high")) {
    report(node.pos, `band: give both "low" and "high", e.g. { "low": "1.8MHz", "high": "30MHz" }`);
    return false;
  }
  if (low === void 0 || high === void 0) return false;
  if (low <= 0) {
    report(lowPos, "band.low: must be above 0 Hz (the sweep is logarithmic)");
    return false;
  }
  if (high <= low) {
    report(highPos, "band.high: must be above band.low");
    return false;
  }
  config.band = { low, high, isDefault: false };
  return true;
}
function readRails(node, config, report) {
  if (node.kind !== "object") {
    report(node.pos, `rails: expected { "VCC": "12V" } (net name -> voltage), found ${kindNoun(node)}`);
    return;
  }
  for (const entry of node.entries) {
    if (entry.key.trim() === "") {
      report(entry.keyPos, "rails: a net name cannot be empty");
      continue;
    }
    const volts = readQuantity(entry.value, "V", `rails.${entry.key}`, report);
    if (volts !== void 0) config.rails[entry.key] = volts;
  }
}
function readSeries(node, config, defaulted, report) {
  if (node.kind !== "object") {
    report(node.pos, `series: expected { "resistor": "E24", "capacitor": "E12", \u2026 }, found ${kindNoun(node)}`);
    return;
  }
  for (const entry of node.entries) {
    const key = entry.key;
    const value = entry.value;
    if (key === "capacitorCheck") {
      if (value.kind !== "boolean") report(value.pos, `series.capacitorCheck: expected true or false, found ${kindNoun(value)}`);
      else {
        config.series.capacitorCheck = value.value;
        defaulted.delete("series.capacitorCheck");
      }
    } else if (key === "resistor" || key === "capacitor" || key === "inductor") {
      const name = value.kind === "string" ? value.value.toUpperCase() : void 0;
      const series2 = E_SERIES2.find((s) => s === name);
      if (series2 === void 0) {
        report(value.pos, `series.${key}: expected one of ${E_SERIES2.join(", ")} (IEC 60063), found ${kindNoun(value)}`);
      } else {
        config.series[key] = series2;
        defaulted.delete(`series.${key}`);
      }
    } else {
      report(entry.keyPos, `unknown key 'series.${key}'${suggest(key, SERIES_KEYS)}; known keys: ${SERIES_KEYS.join(", ")}`);
    }
  }
}
function readRules(node, config, knownRules, report) {
  if (node.kind !== "object") {
    report(node.pos, `rules: expected { "<rule-id>": "off" | "error" | "warning" | "note" | { \u2026 } }, found ${kindNoun(node)}`);
    return;
  }
  const ids = knownRules.map((r) => r.id);
  for (const entry of node.entries) {
    const rule = knownRules.find((r) => r.id === entry.key);
    if (!rule) {
      report(entry.keyPos, `unknown rule '${entry.key}'${suggest(entry.key, ids)}; \`loadline rules\` lists them`);
      continue;
    }
    const setting = readRuleSetting(entry, rule, report);
    if (setting) config.rules[rule.id] = setting;
  }
}
function readLevel(node, where4, report) {
  const level = node.kind === "string" ? RULE_LEVELS.find((l) => l === node.value) : void 0;
  if (level === void 0) {
    report(node.pos, `${where4}: expected one of ${RULE_LEVELS.map((l) => `"${l}"`).join(", ")}, found ${kindNoun(node)}`);
  }
  return level;
}
function readRuleSetting(entry, rule, report) {
  const where4 = `rules.${rule.id}`;
  const node = entry.value;
  if (node.kind === "string") {
    const severity = readLevel(node, where4, report);
    return severity === void 0 ? void 0 : { severity, options: {} };
  }
  if (node.kind !== "object") {
    report(node.pos, `${where4}: expected a severity ("off", "error", "warning", "note") or { "severity": \u2026, "options": { \u2026 } }, found ${kindNoun(node)}`);
    return void 0;
  }
  const setting = { options: {} };
  for (const inner of node.entries) {
    if (inner.key === "severity") {
      const severity = readLevel(inner.value, `${where4}.severity`, report);
      if (severity !== void 0) setting.severity = severity;
    } else if (inner.key === "options") {
      readRuleOptions(inner.value, rule, setting, report);
    } else {
      report(inner.keyPos, `unknown key '${where4}.${inner.key}'${suggest(inner.key, ["severity", "options"])}; known keys: severity, options`);
    }
  }
  return setting;
}
function readRuleOptions(node, rule, setting, report) {
  const where4 = `rules.${rule.id}.options`;
  const names = Object.keys(rule.options);
  if (node.kind !== "object") {
    report(node.pos, `${where4}: expected an object of option values, found ${kindNoun(node)}`);
    return;
  }
  for (const entry of node.entries) {
    const option = rule.options[entry.key];
    if (!option) {
      const known = names.length > 0 ? `known options: ${names.join(", ")}` : "this rule has no options";
      report(entry.keyPos, `unknown option '${entry.key}' for rule '${rule.id}'${suggest(entry.key, names)}; ${known}`);
      continue;
    }
    const checked = checkRuleOption(option, plainValue(entry.value));
    if (checked.ok) setting.options[entry.key] = checked.value;
    else report(entry.value.pos, `${where4}.${entry.key}: expected ${checked.expected}, found ${kindNoun(entry.value)}`);
  }
}
function suggest(word, known) {
  let best;
  let bestDistance = 3;
  for (const candidate of known) {
    const d = editDistance(word.toLowerCase(), candidate.toLowerCase());
    if (d < bestDistance) {
      best = candidate;
      bestDistance = d;
    }
  }
  return best === void 0 ? "" : ` (did you mean '${best}'?)`;
}
function editDistance(a, b) {
  if (Math.abs(a.length - b.length) > 8) return 9;
  const rows = a.length + 1;
  const cols = b.length + 1;
  const d = new Array(rows * cols).fill(0);
  const at = (i, j) => d[i * cols + j] ?? 0;
  for (let i = 0; i < rows; i++) d[i * cols] = i;
  for (let j = 0; j < cols; j++) d[j] = j;
  for (let i = 1; i < rows; i++) {
    for (let j = 1; j < cols; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let v = Math.min(at(i - 1, j) + 1, at(i, j - 1) + 1, at(i - 1, j - 1) + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) v = Math.min(v, at(i - 2, j - 2) + 1);
      d[i * cols + j] = v;
    }
  }
  return at(a.length, b.length);
}
function exists(fs, path) {
  return typeof fs.realpath(path) === "string";
}
function findConfigFile(designPath, fs) {
  return findConfigFileFrom(dirname4(resolve(designPath)), fs);
}
function findConfigFileFrom(folder, fs) {
  let dir = resolve(folder);
  for (let depth = 0; depth < 256; depth++) {
    const candidate = join3(dir, CONFIG_FILE_NAME);
    if (exists(fs, candidate)) return candidate;
    if (exists(fs, join3(dir, ".git"))) return void 0;
    const parent = dirname4(dir);
    if (parent === dir) return void 0;
    dir = parent;
  }
  return void 0;
}

// src/solve/device.ts
var TOLERANCES = { reltol: 1e-3, vntol: 1e-6, abstol: 1e-12 };
function currentSettled(predicted, previous) {
  const tol = TOLERANCES.reltol * Math.max(Math.abs(predicted), Math.abs(previous)) + TOLERANCES.abstol;
  return Math.abs(predicted - previous) <= tol;
}
var ElaborationMemo = class {
  byKind = /* @__PURE__ */ new Map();
  /**
   * `make()`, or what it returned for the same kind, card and size earlier in this elaboration.
   * `kind` must be the model's own (its parameter table), so one kind always stores one type.
   */
  derived(kind, card, size, make) {
    let cards = this.byKind.get(kind);
    if (!cards) this.byKind.set(kind, cards = /* @__PURE__ */ new Map());
    let sizes = cards.get(card);
    if (!sizes) cards.set(card, sizes = /* @__PURE__ */ new Map());
    if (sizes.has(size)) return sizes.get(size);
    const made = make();
    sizes.set(size, made);
    return made;
  }
};

// src/solve/views.ts
var NO_DOUBLES = new Float64Array(0);
var NO_INTS = new Int32Array(0);
function int32Views(lengths) {
  let total = 0;
  for (const n of lengths) total += n;
  const buffer = new ArrayBuffer(4 * total);
  let offset = 0;
  return lengths.map((n) => {
    const view = new Int32Array(buffer, 4 * offset, n);
    offset += n;
    return view;
  });
}
function float64Views(lengths) {
  let total = 0;
  for (const n of lengths) total += n;
  const buffer = new ArrayBuffer(8 * total);
  let offset = 0;
  return lengths.map((n) => {
    const view = new Float64Array(buffer, 8 * offset, n);
    offset += n;
    return view;
  });
}
var Arena = class {
  doubles;
  ints;
  doublesUsed = 0;
  intsUsed = 0;
  constructor(doubles, ints) {
    const buffer = new ArrayBuffer(8 * doubles + 4 * ints);
    this.doubles = new Float64Array(buffer, 0, doubles);
    this.ints = new Int32Array(buffer, 8 * doubles, ints);
  }
  get doubleCapacity() {
    return this.doubles.length;
  }
  get intCapacity() {
    return this.ints.length;
  }
  f64(length) {
    const end = this.doublesUsed + length;
    if (end > this.doubles.length) return new Float64Array(length);
    const view = this.doubles.subarray(this.doublesUsed, end);
    this.doublesUsed = end;
    return view;
  }
  i32(length) {
    const end = this.intsUsed + length;
    if (end > this.ints.length) return new Int32Array(length);
    const view = this.ints.subarray(this.intsUsed, end);
    this.intsUsed = end;
    return view;
  }
  /** Clears what was handed out and makes all of it available again. */
  reset() {
    this.doubles.fill(0, 0, this.doublesUsed);
    this.ints.fill(0, 0, this.intsUsed);
    this.doublesUsed = 0;
    this.intsUsed = 0;
  }
};
var spareArenas = [];
var SPARE_ARENAS = 4;
function acquireArena(doubles, ints) {
  for (let i = spareArenas.length - 1; i >= 0; i--) {
    const arena = spareArenas[i];
    if (arena.doubleCapacity >= doubles && arena.intCapacity >= ints) {
      spareArenas.splice(i, 1);
      arena.reset();
      return arena;
    }
  }
  return new Arena(doubles, ints);
}
function releaseArena(arena) {
  if (spareArenas.length >= SPARE_ARENAS) spareArenas.shift();
  spareArenas.push(arena);
}

// src/solve/sparse-lu.ts
var SINGULAR_RELATIVE = 1e-14;
var GrowableIndex = class {
  constructor(data) {
    this.data = data;
  }
  data;
  ensure(size) {
    if (size <= this.data.length) return;
    let cap = this.data.length;
    while (cap < size) cap *= 2;
    const grown = new Int32Array(cap);
    grown.set(this.data);
    this.data = grown;
  }
};
var GrowableValues = class {
  constructor(data) {
    this.data = data;
  }
  data;
  ensure(size) {
    if (size <= this.data.length) return;
    let cap = this.data.length;
    while (cap < size) cap *= 2;
    const grown = new Float64Array(cap);
    grown.set(this.data);
    this.data = grown;
  }
};
var SparseLuBase = class {
  n;
  Lp;
  Up;
  Li;
  Ui;
  /** pinv[row] = pivot step that chose `row`, or −1 while the row is still free. */
  pinv;
  order;
  xi;
  pstack;
  mark;
  markStamp = 0;
  /** Where a real factorisation inside a solve takes its arrays from (see Arena). */
  arena;
  constructor(n, capacity, arena) {
    this.n = n;
    this.arena = arena;
    const [Lp, Up, pinv, order, xi, pstack, mark, Li, Ui] = arena ? [arena.i32(n + 1), arena.i32(n + 1), arena.i32(n), arena.i32(n), arena.i32(n), arena.i32(n), arena.i32(n), arena.i32(capacity), arena.i32(capacity)] : int32Views([n + 1, n + 1, n, n, n, n, n, capacity, capacity]);
    this.Lp = Lp;
    this.Up = Up;
    this.pinv = pinv;
    this.order = order;
    this.xi = xi;
    this.pstack = pstack;
    this.mark = mark;
    this.Li = new GrowableIndex(Li);
    this.Ui = new GrowableIndex(Ui);
  }
  /** Rows reachable from the pattern of A(:,col) through the columns of L built so far, topologically sorted into xi[top..n). */
  reach(pattern, col) {
    const n = this.n;
    const { colPtr, rowIdx } = pattern;
    const Lp = this.Lp, Li = this.Li.data, pinv = this.pinv, xi = this.xi, pstack = this.pstack, mark = this.mark;
    const stamp = ++this.markStamp;
    let top = n;
    const end = colPtr[col + 1];
    for (let p = colPtr[col]; p < end; p++) {
      const start = rowIdx[p];
      if (mark[start] === stamp) continue;
      let headPos = 0;
      xi[0] = start;
      while (headPos >= 0) {
        const j = xi[headPos];
        const jnew = pinv[j];
        if (mark[j] !== stamp) {
          mark[j] = stamp;
          pstack[headPos] = jnew < 0 ? 0 : Lp[jnew] + 1;
        }
        let done = true;
        const pEnd = jnew < 0 ? 0 : Lp[jnew + 1];
        for (let q = pstack[headPos]; q < pEnd; q++) {
          const i = Li[q];
          if (mark[i] === stamp) continue;
          pstack[headPos] = q + 1;
          xi[++headPos] = i;
          done = false;
          break;
        }
        if (done) {
          headPos--;
          xi[--top] = j;
        }
      }
    }
    return top;
  }
  /** Entries in L and U (fill report). */
  get factorNonzeros() {
    return this.Lp[this.n] + this.Up[this.n];
  }
  /** Renumbers L's row indices from original rows to pivot order once all columns are done. */
  finishPattern() {
    const lnz = this.Lp[this.n];
    const Li = this.Li.data, pinv = this.pinv;
    for (let p = 0; p < lnz; p++) Li[p] = pinv[Li[p]];
    this.plan = null;
  }
  /**
   * Factor values live in one array per part: U's entries (column by column, diagonal last) at
   * [0, unz), L's entries at unz + their L position. A column update can then name its target
   * with one index whether it lands in U, on the diagonal or in L.
   */
  plan = null;
  /** The refactorisation plan for the current pivot order, compiled on first use. */
  planFor(pattern) {
    if (this.plan) return this.plan;
    const n = this.n;
    const Lp = this.Lp, Li = this.Li.data, Up = this.Up, Ui = this.Ui.data, pinv = this.pinv, order = this.order;
    const unz = Up[n];
    let groups = 0, count = 0;
    for (let k = 0; k < n; k++) {
      const uEnd = Up[k + 1] - 1;
      for (let p = Up[k]; p < uEnd; p++) {
        const j = Ui[p];
        const below = Lp[j + 1] - Lp[j] - 1;
        if (below > 0) {
          groups++;
          count += below;
        }
      }
    }
    const lengths = [n + 1, groups, groups, groups + 1, count, pattern.colPtr[n], n];
    const arena = this.arena;
    const [columnGroups, multiplier, lFirst, groupTargets, targets, cscToFactor, positionOf] = arena ? [arena.i32(lengths[0]), arena.i32(lengths[1]), arena.i32(lengths[2]), arena.i32(lengths[3]), arena.i32(lengths[4]), arena.i32(lengths[5]), arena.i32(lengths[6])] : int32Views(lengths);
    let g = 0, t = 0;
    for (let k = 0; k < n; k++) {
      columnGroups[k] = g;
      const uStart = Up[k], uEnd = Up[k + 1];
      for (let p = uStart; p < uEnd; p++) positionOf[Ui[p]] = p;
      const lEnd = Lp[k + 1];
      for (let q = Lp[k] + 1; q < lEnd; q++) positionOf[Li[q]] = unz + q;
      for (let p = uStart; p < uEnd - 1; p++) {
        const j = Ui[p];
        const start = Lp[j] + 1, end = Lp[j + 1];
        if (start >= end) continue;
        multiplier[g] = p;
        lFirst[g] = unz + start;
        groupTargets[g] = t;
        for (let q = start; q < end; q++) targets[t++] = positionOf[Li[q]];
        g++;
      }
      const col = order[k];
      const aEnd = pattern.colPtr[col + 1];
      for (let p = pattern.colPtr[col]; p < aEnd; p++) {
        cscToFactor[p] = positionOf[pinv[pattern.rowIdx[p]]];
      }
    }
    columnGroups[n] = g;
    groupTargets[g] = t;
    this.plan = { size: unz + Lp[n], unz, columnGroups, multiplier, lFirst, groupTargets, targets, cscToFactor };
    return this.plan;
  }
  /** Where each entry of the CSC value array goes in the factor arrays (valid until the next factor()). */
  factorPositions(pattern) {
    return this.planFor(pattern).cscToFactor;
  }
};
var RealSparseLu = class extends SparseLuBase {
  /** factor()'s work space, grown column by column. */
  Lx;
  Ux;
  /** The factors in the layout of SparseLuBase.plan: U at [0, unz), L at unz + L position. */
  F = NO_DOUBLES;
  x;
  y;
  /** Per pivot step, the pivot's place among the candidate rows in the order factor() met them. */
  pivotRank;
  constructor(n, arena, capacityHint = 4 * n) {
    const capacity = Math.max(16, capacityHint);
    super(n, capacity, arena);
    const [Lx, Ux, x, y] = arena ? [arena.f64(capacity), arena.f64(capacity), arena.f64(n), arena.f64(n)] : float64Views([capacity, capacity, n, n]);
    this.Lx = new GrowableValues(Lx);
    this.Ux = new GrowableValues(Ux);
    this.x = x;
    this.y = y;
    this.pivotRank = arena ? arena.i32(n) : new Int32Array(n);
  }
  factorArray(size) {
    if (this.F.length < size) this.F = this.arena ? this.arena.f64(size) : new Float64Array(size);
    return this.F;
  }
  factor(pattern, values, order, pivotTolerance) {
    const n = this.n;
    const { colPtr, rowIdx } = pattern;
    const pinv = this.pinv, x = this.x, xi = this.xi, Lp = this.Lp, Up = this.Up;
    this.order = order;
    pinv.fill(-1);
    let lnz = 0, unz = 0;
    for (let k = 0; k < n; k++) {
      Lp[k] = lnz;
      Up[k] = unz;
      this.Li.ensure(lnz + n);
      this.Lx.ensure(lnz + n);
      this.Ui.ensure(unz + n);
      this.Ux.ensure(unz + n);
      const Li = this.Li.data, Lx = this.Lx.data, Ui = this.Ui.data, Ux = this.Ux.data;
      const col = order[k];
      const top = this.reach(pattern, col);
      for (let p = top; p < n; p++) x[xi[p]] = 0;
      let colMax = 0;
      const aEnd = colPtr[col + 1];
      for (let p = colPtr[col]; p < aEnd; p++) {
        const v = values[p];
        x[rowIdx[p]] = v;
        if (Math.abs(v) > colMax) colMax = Math.abs(v);
      }
      for (let px = top; px < n; px++) {
        const j = xi[px];
        const J = pinv[j];
        if (J < 0) continue;
        const xj = x[j];
        if (xj === 0) continue;
        const end = Lp[J + 1];
        for (let p = Lp[J] + 1; p < end; p++) {
          const i = Li[p];
          x[i] = x[i] - Lx[p] * xj;
        }
      }
      let ipiv = -1, best = -1;
      for (let p = top; p < n; p++) {
        const i = xi[p];
        if (pinv[i] < 0) {
          const t = Math.abs(x[i]);
          if (t > best) {
            best = t;
            ipiv = i;
          }
        } else {
          Ui[unz] = pinv[i];
          Ux[unz++] = x[i];
        }
      }
      if (ipiv < 0 || !(best > SINGULAR_RELATIVE * colMax) || best === 0) {
        return { ok: false, singularColumn: col };
      }
      if (pinv[col] < 0 && Math.abs(x[col]) >= best * pivotTolerance) ipiv = col;
      let rank = 0;
      for (let p = top; p < n; p++) {
        const i = xi[p];
        if (i === ipiv) break;
        if (pinv[i] < 0) rank++;
      }
      this.pivotRank[k] = rank;
      const pivot = x[ipiv];
      Ui[unz] = k;
      Ux[unz++] = pivot;
      pinv[ipiv] = k;
      Li[lnz] = ipiv;
      Lx[lnz++] = 1;
      for (let p = top; p < n; p++) {
        const i = xi[p];
        if (pinv[i] < 0) {
          Li[lnz] = i;
          Lx[lnz++] = x[i] / pivot;
        }
        x[i] = 0;
      }
    }
    Lp[n] = lnz;
    Up[n] = unz;
    this.finishPattern();
    const F = this.factorArray(unz + lnz);
    F.set(this.Ux.data.subarray(0, unz), 0);
    F.set(this.Lx.data.subarray(0, lnz), unz);
    return { ok: true };
  }
  /**
   * Numeric-only factorisation of a matrix with the same pattern, re-using the pivot order and
   * L/U structure of the last factor(). `values[i]` is the matrix entry that belongs at factor
   * position `positions[i]` (see factorPositions). Returns false — and leaves the factors
   * unusable — when a re-used pivot has become too small against its column, so the caller must
   * fall back to factor().
   */
  refactor(pattern, values, count, positions, pivotTolerance) {
    const plan = this.planFor(pattern);
    const F = this.F;
    F.fill(0, 0, plan.size);
    for (let i = 0; i < count; i++) F[positions[i]] = values[i];
    return this.eliminate(plan, pivotTolerance);
  }
  /** The in-place column updates of the plan, in the left-looking factorisation's order. */
  eliminate(plan, pivotTolerance) {
    const n = this.n, F = this.F, Lp = this.Lp, Up = this.Up;
    const { unz, columnGroups, multiplier, lFirst, groupTargets, targets } = plan;
    let g = 0;
    for (let k = 0; k < n; k++) {
      const gEnd = columnGroups[k + 1];
      for (; g < gEnd; g++) {
        const xj = F[multiplier[g]];
        if (xj === 0) continue;
        const end = groupTargets[g + 1];
        for (let t = groupTargets[g], q = lFirst[g]; t < end; t++, q++) {
          const i = targets[t];
          F[i] = F[i] - F[q] * xj;
        }
      }
      const pivot = F[Up[k + 1] - 1];
      const lStart = unz + Lp[k] + 1, lEnd = unz + Lp[k + 1];
      let largest = 0;
      for (let q = lStart; q < lEnd; q++) {
        const v = F[q];
        largest = Math.max(largest, Math.abs(v));
        F[q] = v / pivot;
      }
      if (!(Math.abs(pivot) > 0) || Math.abs(pivot) < pivotTolerance * largest) return false;
    }
    return true;
  }
  /**
   * The pivot order and L/U structure of the last factor(), with its refactorisation plan, in
   * arrays of its own: what a later solve of the same circuit can start from (adopt).
   */
  exportStructure(pattern) {
    const n = this.n, Lp = this.Lp, Up = this.Up, pinv = this.pinv, order = this.order, pivotRank = this.pivotRank;
    const plan = this.planFor(pattern);
    const lnz = Lp[n], unz = Up[n];
    const groups = plan.multiplier.length;
    const [lp, li, up, ui, pv, or, pr, cr, columnGroups, multiplier, lFirst, groupTargets, targets, cscToFactor] = int32Views([
      n + 1,
      lnz,
      n + 1,
      unz,
      n,
      n,
      n,
      n,
      n + 1,
      groups,
      groups,
      groups + 1,
      plan.targets.length,
      plan.cscToFactor.length
    ]);
    lp.set(Lp.subarray(0, n + 1));
    li.set(this.Li.data.subarray(0, lnz));
    up.set(Up.subarray(0, n + 1));
    ui.set(this.Ui.data.subarray(0, unz));
    pv.set(pinv);
    or.set(order);
    pr.set(pivotRank);
    const Li = this.Li.data;
    for (let k = 0; k < n; k++) {
      const own = pinv[order[k]];
      if (own === k) {
        cr[k] = pivotRank[k];
        continue;
      }
      cr[k] = -1;
      if (own < k) continue;
      const start = Lp[k] + 1, end = Lp[k + 1];
      for (let q = start; q < end; q++) {
        if (Li[q] !== own) continue;
        const place2 = q - start;
        cr[k] = place2 < pivotRank[k] ? place2 : place2 + 1;
        break;
      }
    }
    columnGroups.set(plan.columnGroups);
    multiplier.set(plan.multiplier);
    lFirst.set(plan.lFirst);
    groupTargets.set(plan.groupTargets);
    targets.set(plan.targets);
    cscToFactor.set(plan.cscToFactor);
    return {
      n,
      Lp: lp,
      Li: li,
      Up: up,
      Ui: ui,
      pinv: pv,
      order: or,
      pivotRank: pr,
      ownRank: cr,
      plan: { size: plan.size, unz: plan.unz, columnGroups, multiplier, lFirst, groupTargets, targets, cscToFactor }
    };
  }
  /**
   * factor() by way of a structure exported earlier: the same pivot order and L/U pattern, kept
   * only if, column by column, factor() would have chosen exactly the pivots the structure has
   * from exactly these values — then the factors are factor()'s to the last bit, found without
   * its pivot search and depth-first reach. False (factors unusable) when any choice differs.
   */
  refactorAsFactor(structure, pattern, order, values, count, slotToCsc, pivotTolerance) {
    const n = this.n;
    if (structure.n !== n || structure.plan.cscToFactor.length !== pattern.colPtr[n]) return null;
    for (let k = 0; k < n; k++) if (structure.order[k] !== order[k]) return null;
    const lnz = structure.Lp[n], unz = structure.Up[n];
    this.Lp.set(structure.Lp);
    this.Up.set(structure.Up);
    this.Li.ensure(lnz);
    this.Li.data.set(structure.Li);
    this.Ui.ensure(unz);
    this.Ui.data.set(structure.Ui);
    this.pinv.set(structure.pinv);
    this.order = order;
    this.pivotRank.set(structure.pivotRank);
    const plan = structure.plan;
    this.plan = plan;
    const F = this.factorArray(plan.size);
    F.fill(0, 0, plan.size);
    const positions = new Int32Array(count);
    for (let s = 0; s < count; s++) {
      const f = plan.cscToFactor[slotToCsc[s]];
      positions[s] = f;
      F[f] = values[s];
    }
    return this.eliminateAsFactor(structure, pattern, pivotTolerance) ? positions : null;
  }
  /** eliminate(), checking each pivot against factor()'s choice (see refactorAsFactor). */
  eliminateAsFactor(structure, pattern, pivotTolerance) {
    const n = this.n, F = this.F, Lp = this.Lp, Up = this.Up, order = this.order;
    const { plan, pivotRank, ownRank } = structure;
    const { unz, columnGroups, multiplier, lFirst, groupTargets, targets, cscToFactor } = plan;
    const { colPtr } = pattern;
    let g = 0;
    for (let k = 0; k < n; k++) {
      const col = order[k];
      let colMax = 0;
      const aEnd = colPtr[col + 1];
      for (let p = colPtr[col]; p < aEnd; p++) {
        const v = Math.abs(F[cscToFactor[p]]);
        if (v > colMax) colMax = v;
      }
      const gEnd = columnGroups[k + 1];
      for (; g < gEnd; g++) {
        const xj = F[multiplier[g]];
        if (xj === 0) continue;
        const end = groupTargets[g + 1];
        for (let t = groupTargets[g], q = lFirst[g]; t < end; t++, q++) {
          const i = targets[t];
          F[i] = F[i] - F[q] * xj;
        }
      }
      const pivot = F[Up[k + 1] - 1];
      const lStart = unz + Lp[k] + 1, lEnd = unz + Lp[k + 1];
      const rank = pivotRank[k], own = ownRank[k];
      let best = -1, first = -1, ownMagnitude = 0;
      for (let q = lStart, place2 = 0; ; place2++) {
        let t;
        if (place2 === rank) t = Math.abs(pivot);
        else if (q < lEnd) t = Math.abs(F[q++]);
        else break;
        if (t > best) {
          best = t;
          first = place2;
        }
        if (place2 === own) ownMagnitude = t;
      }
      if (first < 0 || !(best > SINGULAR_RELATIVE * colMax) || best === 0) return false;
      const chosen = own >= 0 && ownMagnitude >= best * pivotTolerance ? own : first;
      if (chosen !== rank) return false;
      for (let q = lStart; q < lEnd; q++) F[q] = F[q] / pivot;
    }
    return true;
  }
  /** Solves A·out = b with the last successful factorisation. */
  solve(b, out) {
    const n = this.n, pinv = this.pinv, y = this.y, order = this.order, F = this.F;
    const Lp = this.Lp, Li = this.Li.data, Up = this.Up, Ui = this.Ui.data;
    const unz = Up[n];
    for (let i = 0; i < n; i++) y[pinv[i]] = b[i];
    for (let j = 0; j < n; j++) {
      const yj = y[j];
      if (yj === 0) continue;
      const end = Lp[j + 1];
      for (let p = Lp[j] + 1; p < end; p++) {
        const i = Li[p];
        y[i] = y[i] - F[unz + p] * yj;
      }
    }
    for (let j = n - 1; j >= 0; j--) {
      const last = Up[j + 1] - 1;
      const yj = y[j] / F[last];
      y[j] = yj;
      if (yj === 0) continue;
      for (let p = Up[j]; p < last; p++) {
        const i = Ui[p];
        y[i] = y[i] - F[p] * yj;
      }
    }
    for (let k = 0; k < n; k++) out[order[k]] = y[k];
  }
};

// src/solve/complex-lu.ts
var ComplexSparseLu = class extends SparseLuBase {
  Lr;
  Lm;
  Ur;
  Um;
  /** Real and imaginary factors in the layout of SparseLuBase.plan. */
  Fr = NO_DOUBLES;
  Fm = NO_DOUBLES;
  xr;
  xm;
  yr;
  ym;
  constructor(n, capacityHint = 4 * n) {
    const capacity = Math.max(16, capacityHint);
    super(n, capacity);
    const [Lr, Lm, Ur, Um, xr, xm, yr, ym] = float64Views([capacity, capacity, capacity, capacity, n, n, n, n]);
    this.Lr = new GrowableValues(Lr);
    this.Lm = new GrowableValues(Lm);
    this.Ur = new GrowableValues(Ur);
    this.Um = new GrowableValues(Um);
    this.xr = xr;
    this.xm = xm;
    this.yr = yr;
    this.ym = ym;
  }
  ensureFactorArrays(size) {
    if (this.Fr.length >= size) return;
    [this.Fr, this.Fm] = float64Views([size, size]);
  }
  factor(pattern, re, im, order, pivotTolerance) {
    const n = this.n;
    const { colPtr, rowIdx } = pattern;
    const pinv = this.pinv, xr = this.xr, xm = this.xm, xi = this.xi, Lp = this.Lp, Up = this.Up;
    this.order = order;
    pinv.fill(-1);
    const tol2 = pivotTolerance * pivotTolerance;
    let lnz = 0, unz = 0;
    for (let k = 0; k < n; k++) {
      Lp[k] = lnz;
      Up[k] = unz;
      this.Li.ensure(lnz + n);
      this.Lr.ensure(lnz + n);
      this.Lm.ensure(lnz + n);
      this.Ui.ensure(unz + n);
      this.Ur.ensure(unz + n);
      this.Um.ensure(unz + n);
      const Li = this.Li.data, Lr = this.Lr.data, Lm = this.Lm.data;
      const Ui = this.Ui.data, Ur = this.Ur.data, Um = this.Um.data;
      const col = order[k];
      const top = this.reach(pattern, col);
      for (let p = top; p < n; p++) {
        const i = xi[p];
        xr[i] = 0;
        xm[i] = 0;
      }
      let colMax2 = 0;
      const aEnd = colPtr[col + 1];
      for (let p = colPtr[col]; p < aEnd; p++) {
        const i = rowIdx[p];
        const vr = re[p], vm = im[p];
        xr[i] = vr;
        xm[i] = vm;
        const m2 = vr * vr + vm * vm;
        if (m2 > colMax2) colMax2 = m2;
      }
      for (let px = top; px < n; px++) {
        const j = xi[px];
        const J = pinv[j];
        if (J < 0) continue;
        const ar = xr[j], am = xm[j];
        if (ar === 0 && am === 0) continue;
        const end = Lp[J + 1];
        for (let p = Lp[J] + 1; p < end; p++) {
          const i = Li[p];
          const lr = Lr[p], lm = Lm[p];
          xr[i] = xr[i] - (lr * ar - lm * am);
          xm[i] = xm[i] - (lr * am + lm * ar);
        }
      }
      let ipiv = -1, best2 = -1;
      for (let p = top; p < n; p++) {
        const i = xi[p];
        if (pinv[i] < 0) {
          const vr = xr[i], vm = xm[i];
          const t = vr * vr + vm * vm;
          if (t > best2) {
            best2 = t;
            ipiv = i;
          }
        } else {
          Ui[unz] = pinv[i];
          Ur[unz] = xr[i];
          Um[unz++] = xm[i];
        }
      }
      const rel2 = SINGULAR_RELATIVE * SINGULAR_RELATIVE;
      if (ipiv < 0 || !(best2 > rel2 * colMax2) || best2 === 0) return { ok: false, singularColumn: col };
      if (pinv[col] < 0) {
        const dr = xr[col], dm = xm[col];
        if (dr * dr + dm * dm >= best2 * tol2) ipiv = col;
      }
      const pr = xr[ipiv], pm = xm[ipiv];
      const pmag2 = pr * pr + pm * pm;
      const invR = pr / pmag2, invM = -pm / pmag2;
      Ui[unz] = k;
      Ur[unz] = pr;
      Um[unz++] = pm;
      pinv[ipiv] = k;
      Li[lnz] = ipiv;
      Lr[lnz] = 1;
      Lm[lnz++] = 0;
      for (let p = top; p < n; p++) {
        const i = xi[p];
        if (pinv[i] < 0) {
          const vr = xr[i], vm = xm[i];
          Li[lnz] = i;
          Lr[lnz] = vr * invR - vm * invM;
          Lm[lnz++] = vr * invM + vm * invR;
        }
        xr[i] = 0;
        xm[i] = 0;
      }
    }
    Lp[n] = lnz;
    Up[n] = unz;
    this.finishPattern();
    this.ensureFactorArrays(unz + lnz);
    const Fr = this.Fr, Fm = this.Fm;
    Fr.set(this.Ur.data.subarray(0, unz), 0);
    Fm.set(this.Um.data.subarray(0, unz), 0);
    Fr.set(this.Lr.data.subarray(0, lnz), unz);
    Fm.set(this.Lm.data.subarray(0, lnz), unz);
    return { ok: true };
  }
  /** Complex counterpart of RealSparseLu.refactor. */
  refactor(pattern, re, im, count, positions, pivotTolerance) {
    const plan = this.planFor(pattern);
    const Fr = this.Fr, Fm = this.Fm;
    Fr.fill(0, 0, plan.size);
    Fm.fill(0, 0, plan.size);
    for (let i = 0; i < count; i++) {
      const f = positions[i];
      Fr[f] = re[i];
      Fm[f] = im[i];
    }
    return this.eliminate(plan, pivotTolerance);
  }
  /**
   * An affine-in-ω matrix Y0 + ω·Y1 in the factors' layout: Y0 in full (zero where L and U fill
   * in), Y1 only where it is not zero (the capacitances — a fraction of the entries).
   */
  affine = null;
  /**
   * Remembers Y0 and Y1 (slot values placed by `positions`) for refactorAffine, which then forms
   * Y0 + ω·Y1 as a copy of Y0 plus ω·Y1 where Y1 has entries.
   */
  loadAffine(pattern, y0Re, y0Im, y1Re, y1Im, count, positions) {
    const plan = this.planFor(pattern);
    let varying = 0;
    for (let i = 0; i < count; i++) if (y1Re[i] !== 0 || y1Im[i] !== 0) varying++;
    const [y0r, y0m, y1r, y1m] = float64Views([plan.size, plan.size, varying, varying]);
    const at = new Int32Array(varying);
    for (let i = 0, v = 0; i < count; i++) {
      const f = positions[i];
      y0r[f] = y0Re[i];
      y0m[f] = y0Im[i];
      if (y1Re[i] !== 0 || y1Im[i] !== 0) {
        at[v] = f;
        y1r[v] = y1Re[i];
        y1m[v++] = y1Im[i];
      }
    }
    this.affine = { plan, y0r, y0m, at, y1r, y1m };
  }
  /** refactor() of Y0 + ω·Y1 as given to loadAffine; false also when nothing is loaded for this plan. */
  refactorAffine(omega, pivotTolerance) {
    const a = this.affine;
    if (!a || a.plan !== this.plan) return false;
    const Fr = this.Fr, Fm = this.Fm, { y0r, y0m, at, y1r, y1m } = a;
    Fr.set(y0r);
    Fm.set(y0m);
    for (let v = 0; v < at.length; v++) {
      const f = at[v];
      Fr[f] = y0r[f] + omega * y1r[v];
      Fm[f] = y0m[f] + omega * y1m[v];
    }
    return this.eliminate(a.plan, pivotTolerance);
  }
  eliminate(plan, pivotTolerance) {
    const n = this.n, Fr = this.Fr, Fm = this.Fm, Lp = this.Lp, Up = this.Up;
    const { unz, columnGroups, multiplier, lFirst, groupTargets, targets } = plan;
    const tol2 = pivotTolerance * pivotTolerance;
    let g = 0;
    for (let k = 0; k < n; k++) {
      const gEnd = columnGroups[k + 1];
      for (; g < gEnd; g++) {
        const m = multiplier[g];
        const ar = Fr[m], am = Fm[m];
        if (ar === 0 && am === 0) continue;
        const end = groupTargets[g + 1];
        for (let t = groupTargets[g], q = lFirst[g]; t < end; t++, q++) {
          const i = targets[t];
          const lr = Fr[q], lm = Fm[q];
          Fr[i] = Fr[i] - (lr * ar - lm * am);
          Fm[i] = Fm[i] - (lr * am + lm * ar);
        }
      }
      const d = Up[k + 1] - 1;
      const pr = Fr[d], pm = Fm[d];
      const pmag2 = pr * pr + pm * pm;
      const invR = pr / pmag2, invM = -pm / pmag2;
      const lStart = unz + Lp[k] + 1, lEnd = unz + Lp[k + 1];
      let largest2 = 0;
      for (let q = lStart; q < lEnd; q++) {
        const vr = Fr[q], vm = Fm[q];
        largest2 = Math.max(largest2, vr * vr + vm * vm);
        Fr[q] = vr * invR - vm * invM;
        Fm[q] = vr * invM + vm * invR;
      }
      if (!(pmag2 > 0) || pmag2 < tol2 * largest2) return false;
    }
    return true;
  }
  solve(bRe, bIm, outRe, outIm) {
    const n = this.n, pinv = this.pinv, yr = this.yr, ym = this.ym, order = this.order;
    const Lp = this.Lp, Li = this.Li.data, Up = this.Up, Ui = this.Ui.data, Fr = this.Fr, Fm = this.Fm;
    const unz = Up[n];
    for (let i = 0; i < n; i++) {
      const k = pinv[i];
      yr[k] = bRe[i];
      ym[k] = bIm[i];
    }
    for (let j = 0; j < n; j++) {
      const ar = yr[j], am = ym[j];
      if (ar === 0 && am === 0) continue;
      const end = Lp[j + 1];
      for (let p = Lp[j] + 1; p < end; p++) {
        const i = Li[p];
        const lr = Fr[unz + p], lm = Fm[unz + p];
        yr[i] = yr[i] - (lr * ar - lm * am);
        ym[i] = ym[i] - (lr * am + lm * ar);
      }
    }
    for (let j = n - 1; j >= 0; j--) {
      const last = Up[j + 1] - 1;
      const dr = Fr[last], dm = Fm[last];
      const d2 = dr * dr + dm * dm;
      const vr = yr[j], vm = ym[j];
      const ar = (vr * dr + vm * dm) / d2;
      const am = (vm * dr - vr * dm) / d2;
      yr[j] = ar;
      ym[j] = am;
      if (ar === 0 && am === 0) continue;
      for (let p = Up[j]; p < last; p++) {
        const i = Ui[p];
        const ur = Fr[p], um = Fm[p];
        yr[i] = yr[i] - (ur * ar - um * am);
        ym[i] = ym[i] - (ur * am + um * ar);
      }
    }
    for (let k = 0; k < n; k++) {
      const o = order[k];
      outRe[o] = yr[k];
      outIm[o] = ym[k];
    }
  }
  /** Factors of the second matrix of a pair (see refactorAffinePair), in the layout of Fr/Fm. */
  Gr = NO_DOUBLES;
  Gm = NO_DOUBLES;
  zr = NO_DOUBLES;
  zm = NO_DOUBLES;
  /**
   * refactorAffine at two frequencies in one pass over the plan: each index is read once for
   * both matrices. Each matrix sees exactly the operations refactorAffine would do; false when
   * either needs fresh pivots (the caller then takes the points one at a time).
   */
  refactorAffinePair(omegaA, omegaB, pivotTolerance) {
    const a = this.affine;
    if (!a || a.plan !== this.plan) return false;
    const plan = a.plan, size = plan.size;
    if (this.Gr.length < size) [this.Gr, this.Gm] = float64Views([size, size]);
    const Fr = this.Fr, Fm = this.Fm, Gr = this.Gr, Gm = this.Gm, { y0r, y0m, at, y1r, y1m } = a;
    Fr.set(y0r);
    Fm.set(y0m);
    Gr.set(y0r);
    Gm.set(y0m);
    for (let v = 0; v < at.length; v++) {
      const f = at[v];
      const r0 = y0r[f], m0 = y0m[f], r12 = y1r[v], m1 = y1m[v];
      Fr[f] = r0 + omegaA * r12;
      Fm[f] = m0 + omegaA * m1;
      Gr[f] = r0 + omegaB * r12;
      Gm[f] = m0 + omegaB * m1;
    }
    const n = this.n, Lp = this.Lp, Up = this.Up;
    const { unz, columnGroups, multiplier, lFirst, groupTargets, targets } = plan;
    const tol2 = pivotTolerance * pivotTolerance;
    let g = 0;
    for (let k = 0; k < n; k++) {
      const gEnd = columnGroups[k + 1];
      for (; g < gEnd; g++) {
        const m = multiplier[g];
        const ar = Fr[m], am = Fm[m], br = Gr[m], bm = Gm[m];
        const skipA = ar === 0 && am === 0, skipB = br === 0 && bm === 0;
        if (skipA && skipB) continue;
        const start = groupTargets[g], end = groupTargets[g + 1], q0 = lFirst[g];
        if (!skipA && !skipB) {
          for (let t = start, q = q0; t < end; t++, q++) {
            const i = targets[t];
            const lr = Fr[q], lm = Fm[q], kr = Gr[q], km = Gm[q];
            Fr[i] = Fr[i] - (lr * ar - lm * am);
            Fm[i] = Fm[i] - (lr * am + lm * ar);
            Gr[i] = Gr[i] - (kr * br - km * bm);
            Gm[i] = Gm[i] - (kr * bm + km * br);
          }
        } else {
          const Xr = skipA ? Gr : Fr, Xm = skipA ? Gm : Fm, xr = skipA ? br : ar, xm = skipA ? bm : am;
          for (let t = start, q = q0; t < end; t++, q++) {
            const i = targets[t];
            const lr = Xr[q], lm = Xm[q];
            Xr[i] = Xr[i] - (lr * xr - lm * xm);
            Xm[i] = Xm[i] - (lr * xm + lm * xr);
          }
        }
      }
      const d = Up[k + 1] - 1;
      const pr = Fr[d], pm = Fm[d], sr = Gr[d], sm = Gm[d];
      const pmag2 = pr * pr + pm * pm, smag2 = sr * sr + sm * sm;
      const invR = pr / pmag2, invM = -pm / pmag2, jnvR = sr / smag2, jnvM = -sm / smag2;
      const lStart = unz + Lp[k] + 1, lEnd = unz + Lp[k + 1];
      let largestA = 0, largestB = 0;
      for (let q = lStart; q < lEnd; q++) {
        const vr = Fr[q], vm = Fm[q], wr = Gr[q], wm = Gm[q];
        largestA = Math.max(largestA, vr * vr + vm * vm);
        largestB = Math.max(largestB, wr * wr + wm * wm);
        Fr[q] = vr * invR - vm * invM;
        Fm[q] = vr * invM + vm * invR;
        Gr[q] = wr * jnvR - wm * jnvM;
        Gm[q] = wr * jnvM + wm * jnvR;
      }
      if (!(pmag2 > 0) || pmag2 < tol2 * largestA || !(smag2 > 0) || smag2 < tol2 * largestB) return false;
    }
    return true;
  }
  /** solve() with both factorisations of the last refactorAffinePair, for one right-hand side. */
  solvePair(bRe, bIm, aRe, aIm, cRe, cIm) {
    const n = this.n, pinv = this.pinv, order = this.order;
    if (this.zr.length < n) [this.zr, this.zm] = float64Views([n, n]);
    const yr = this.yr, ym = this.ym, zr = this.zr, zm = this.zm;
    const Lp = this.Lp, Li = this.Li.data, Up = this.Up, Ui = this.Ui.data, Fr = this.Fr, Fm = this.Fm, Gr = this.Gr, Gm = this.Gm;
    const unz = Up[n];
    yr.fill(0, 0, n);
    ym.fill(0, 0, n);
    for (let i = 0; i < n; i++) {
      const re = bRe[i], im = bIm[i];
      if (re === 0 && im === 0) continue;
      const k = pinv[i];
      yr[k] = re;
      ym[k] = im;
    }
    zr.set(yr.subarray(0, n));
    zm.set(ym.subarray(0, n));
    for (let j = 0; j < n; j++) {
      const ar = yr[j], am = ym[j], br = zr[j], bm = zm[j];
      const skipA = ar === 0 && am === 0, skipB = br === 0 && bm === 0;
      if (skipA && skipB) continue;
      const end = Lp[j + 1];
      for (let p = Lp[j] + 1; p < end; p++) {
        const i = Li[p];
        if (!skipA) {
          const lr = Fr[unz + p], lm = Fm[unz + p];
          yr[i] = yr[i] - (lr * ar - lm * am);
          ym[i] = ym[i] - (lr * am + lm * ar);
        }
        if (!skipB) {
          const kr = Gr[unz + p], km = Gm[unz + p];
          zr[i] = zr[i] - (kr * br - km * bm);
          zm[i] = zm[i] - (kr * bm + km * br);
        }
      }
    }
    for (let j = n - 1; j >= 0; j--) {
      const last = Up[j + 1] - 1;
      const dr = Fr[last], dm = Fm[last], er = Gr[last], em = Gm[last];
      const d2 = dr * dr + dm * dm, e2 = er * er + em * em;
      const vr = yr[j], vm = ym[j], wr = zr[j], wm = zm[j];
      const ar = (vr * dr + vm * dm) / d2, am = (vm * dr - vr * dm) / d2;
      const br = (wr * er + wm * em) / e2, bm = (wm * er - wr * em) / e2;
      yr[j] = ar;
      ym[j] = am;
      zr[j] = br;
      zm[j] = bm;
      const skipA = ar === 0 && am === 0, skipB = br === 0 && bm === 0;
      if (skipA && skipB) continue;
      for (let p = Up[j]; p < last; p++) {
        const i = Ui[p];
        if (!skipA) {
          const ur = Fr[p], um = Fm[p];
          yr[i] = yr[i] - (ur * ar - um * am);
          ym[i] = ym[i] - (ur * am + um * ar);
        }
        if (!skipB) {
          const vr2 = Gr[p], vm2 = Gm[p];
          zr[i] = zr[i] - (vr2 * br - vm2 * bm);
          zm[i] = zm[i] - (vr2 * bm + vm2 * br);
        }
      }
    }
    for (let k = 0; k < n; k++) {
      const o = order[k];
      aRe[o] = yr[k];
      aIm[o] = ym[k];
      cRe[o] = zr[k];
      cIm[o] = zm[k];
    }
  }
};

// src/solve/ordering.ts
function symmetricNeighbours(pattern) {
  const { n, colPtr, rowIdx } = pattern;
  const nnz = colPtr[n];
  const [rowPtr, next, colIdx, mark] = int32Views([n + 1, n, nnz, n]);
  for (let p = 0; p < nnz; p++) {
    const r = rowIdx[p] + 1;
    rowPtr[r] = rowPtr[r] + 1;
  }
  for (let r = 0; r < n; r++) rowPtr[r + 1] = rowPtr[r + 1] + rowPtr[r];
  next.set(rowPtr.subarray(0, n));
  for (let c = 0; c < n; c++) {
    const end = colPtr[c + 1];
    for (let p = colPtr[c]; p < end; p++) {
      const r = rowIdx[p];
      const at = next[r];
      colIdx[at] = c;
      next[r] = at + 1;
    }
  }
  mark.fill(-1);
  const lists = new Array(n);
  for (let v = 0; v < n; v++) {
    const list2 = [];
    mark[v] = v;
    const rEnd = rowPtr[v + 1];
    let q = rowPtr[v];
    for (; q < rEnd && colIdx[q] < v; q++) {
      const c = colIdx[q];
      if (mark[c] !== v) {
        mark[c] = v;
        list2.push(c);
      }
    }
    const cEnd = colPtr[v + 1];
    for (let p = colPtr[v]; p < cEnd; p++) {
      const r = rowIdx[p];
      if (mark[r] !== v) {
        mark[r] = v;
        list2.push(r);
      }
    }
    for (; q < rEnd; q++) {
      const c = colIdx[q];
      if (mark[c] !== v) {
        mark[c] = v;
        list2.push(c);
      }
    }
    lists[v] = list2;
  }
  return lists;
}
function minimumDegreeOrder(pattern) {
  const n = pattern.n;
  const adjacency = symmetricNeighbours(pattern);
  const [head, next, prev, degree, mark, order, live, eliminated] = int32Views([n + 1, n, n, n, n, n, n, n]);
  head.fill(-1);
  next.fill(-1);
  prev.fill(-1);
  const insert = (v, d) => {
    degree[v] = d;
    prev[v] = -1;
    const h = head[d];
    next[v] = h;
    if (h >= 0) prev[h] = v;
    head[d] = v;
  };
  const remove = (v) => {
    const d = degree[v];
    const p = prev[v];
    const nx = next[v];
    if (p >= 0) next[p] = nx;
    else head[d] = nx;
    if (nx >= 0) prev[nx] = p;
  };
  const compact = (u) => {
    const list2 = adjacency[u];
    if (list2.length <= 2 * live[u]) return list2;
    const kept = list2.filter((w) => eliminated[w] === 0);
    adjacency[u] = kept;
    return kept;
  };
  for (let v = n - 1; v >= 0; v--) {
    const d = adjacency[v].length;
    live[v] = d;
    insert(v, Math.min(n, d));
  }
  let stamp = 0;
  let minDegree = 0;
  const neighbours2 = new Int32Array(n);
  for (let step = 0; step < n; step++) {
    while (minDegree <= n && head[minDegree] < 0) minDegree++;
    const v = minDegree <= n ? head[minDegree] : -1;
    if (v < 0) throw new Error("minimumDegreeOrder: bucket structure corrupted");
    remove(v);
    order[step] = v;
    eliminated[v] = 1;
    let count = 0;
    for (const u of adjacency[v]) if (eliminated[u] === 0) neighbours2[count++] = u;
    adjacency[v] = [];
    for (let a = 0; a < count; a++) {
      const u = neighbours2[a];
      live[u] = live[u] - 1;
    }
    for (let a = 0; a + 1 < count; a++) {
      const u = neighbours2[a];
      const listU = compact(u);
      let candidatesLength = 0;
      for (let b = a + 1; b < count; b++) candidatesLength += adjacency[neighbours2[b]].length;
      const markU = listU.length <= candidatesLength;
      if (markU) {
        stamp++;
        for (const x of listU) mark[x] = stamp;
      }
      for (let b = a + 1; b < count; b++) {
        const w = neighbours2[b];
        const listW = adjacency[w];
        if (markU ? mark[w] === stamp : listW.includes(u)) continue;
        listU.push(w);
        live[u] = live[u] + 1;
        listW.push(u);
        live[w] = live[w] + 1;
      }
    }
    for (let a = 0; a < count; a++) {
      const u = neighbours2[a];
      remove(u);
      const d = Math.min(n, live[u]);
      insert(u, d);
      if (d < minDegree) minDegree = d;
    }
  }
  return order;
}

// src/solve/pattern.ts
var NO_PATTERN = { n: 0, colPtr: new Int32Array(1), rowIdx: NO_INTS };
var SlotTape = class {
  rows;
  cols;
  slots;
  length = 0;
  /** The arrays belong to a snapshot too: copy before the first write. */
  shared = false;
  /** A new tape of `capacity` positions, or (given arrays) one sharing a snapshot's arrays. */
  constructor(capacity, shared) {
    if (shared) {
      ({ rows: this.rows, cols: this.cols, slots: this.slots, length: this.length } = shared);
      this.shared = true;
      return;
    }
    [this.rows, this.cols, this.slots] = int32Views([capacity, capacity, capacity]);
  }
  record(position, row, col, slot) {
    if (position >= this.rows.length || this.shared) {
      const cap = position >= this.rows.length ? this.rows.length * 2 : this.rows.length;
      const [rows, cols, slots] = int32Views([cap, cap, cap]);
      rows.set(this.rows);
      cols.set(this.cols);
      slots.set(this.slots);
      this.rows = rows;
      this.cols = cols;
      this.slots = slots;
      this.shared = false;
    }
    this.rows[position] = row;
    this.cols[position] = col;
    this.slots[position] = slot;
    if (position >= this.length) this.length = position + 1;
  }
};
var SlotTable = class _SlotTable {
  table;
  mask;
  rows;
  cols;
  count = 0;
  /** The arrays belong to a snapshot too: copy before the first write. */
  shared = false;
  /** A new table for about `capacity` slots, or (given arrays) one sharing a snapshot's arrays. */
  constructor(capacity, shared) {
    if (shared) {
      ({ table: this.table, mask: this.mask, rows: this.rows, cols: this.cols, count: this.count } = shared);
      this.shared = true;
      return;
    }
    let size = 16;
    while (size < 2 * capacity) size *= 2;
    [this.table, this.rows, this.cols] = int32Views([size, capacity, capacity]);
    this.table.fill(-1);
    this.mask = size - 1;
  }
  static hash(row, col) {
    return Math.imul(row, 2654435761) ^ Math.imul(col, 2246822519);
  }
  /** The slot of (row, col), or −1. */
  find(row, col) {
    const table2 = this.table, mask = this.mask;
    for (let h = _SlotTable.hash(row, col) & mask; ; h = h + 1 & mask) {
      const slot = table2[h];
      if (slot < 0 || this.rows[slot] === row && this.cols[slot] === col) return slot;
    }
  }
  /** Adds (row, col), known to be absent, as the next slot. */
  insert(row, col) {
    const slot = this.count++;
    if (slot >= this.rows.length || this.shared) {
      const cap = slot >= this.rows.length ? this.rows.length * 2 : this.rows.length;
      const [rows, cols] = int32Views([cap, cap]);
      rows.set(this.rows);
      cols.set(this.cols);
      this.rows = rows;
      this.cols = cols;
    }
    this.rows[slot] = row;
    this.cols[slot] = col;
    if (2 * this.count > this.table.length) this.rehash(this.table.length * 2);
    else if (this.shared) this.rehash(this.table.length);
    else this.place(slot);
    this.shared = false;
    return slot;
  }
  place(slot) {
    const table2 = this.table, mask = this.mask;
    let h = _SlotTable.hash(this.rows[slot], this.cols[slot]) & mask;
    while (table2[h] >= 0) h = h + 1 & mask;
    table2[h] = slot;
  }
  rehash(size) {
    this.table = new Int32Array(size).fill(-1);
    this.mask = size - 1;
    for (let s = 0; s < this.count; s++) this.place(s);
  }
};
var MatrixPattern = class {
  n;
  slots;
  tape;
  cursor = 0;
  symbolicStale = true;
  /** No symbolic analysis yet, neither made nor inherited from a snapshot. */
  neverPrepared = true;
  /** Started from a snapshot (see snapshot()). */
  fromSnapshot = false;
  /**
   * Started from a snapshot, and the first assembly did not replay its stamps: the circuit is
   * not the one the snapshot was made from (an element edited in place).
   */
  offSnapshot = false;
  /** The first factorisation has been asked for (prepare() called), so a first assembly is over. */
  assembled = false;
  csc = NO_PATTERN;
  /** Position of each slot inside the CSC value array. */
  slotToCsc = NO_INTS;
  order = NO_INTS;
  constructor(n, from) {
    this.n = n;
    if (from && from.n === n) {
      this.slots = new SlotTable(0, from);
      this.tape = new SlotTape(0, { rows: from.tapeRows, cols: from.tapeCols, slots: from.tapeSlots, length: from.tapeLength });
      this.csc = from.csc;
      this.slotToCsc = from.slotToCsc;
      this.order = from.order;
      this.symbolicStale = false;
      this.neverPrepared = false;
      this.fromSnapshot = true;
      return;
    }
    this.slots = new SlotTable(6 * n + 16);
    this.tape = new SlotTape(12 * n + 16);
  }
  /**
   * The current state for another system over the same circuit (valid after prepare()). Both
   * then share the arrays until one of them meets a stamp the other has not seen.
   */
  snapshot() {
    const { slots, tape } = this;
    slots.shared = true;
    tape.shared = true;
    return {
      n: this.n,
      table: slots.table,
      mask: slots.mask,
      rows: slots.rows,
      cols: slots.cols,
      count: slots.count,
      tapeRows: tape.rows,
      tapeCols: tape.cols,
      tapeSlots: tape.slots,
      tapeLength: tape.length,
      csc: this.csc,
      slotToCsc: this.slotToCsc,
      order: this.order
    };
  }
  get slotCount() {
    return this.slots.count;
  }
  /** New entries wait for the next prepare(). */
  get stale() {
    return this.symbolicStale;
  }
  /** Starts a new sequence of stamps at tape position `position` (0: from the beginning). */
  rewind(position = 0) {
    this.cursor = position;
  }
  get position() {
    return this.cursor;
  }
  /** Slot for (row, col), both already known to be non-ground. */
  slot(row, col) {
    const position = this.cursor++;
    const tape = this.tape;
    if (position < tape.length && tape.rows[position] === row && tape.cols[position] === col) {
      return tape.slots[position];
    }
    if (this.fromSnapshot && !this.assembled) this.offSnapshot = true;
    let slot = this.slots.find(row, col);
    if (slot < 0) {
      slot = this.slots.insert(row, col);
      this.symbolicStale = true;
    }
    tape.record(position, row, col, slot);
    return slot;
  }
  /** Rebuilds the CSC pattern (every diagonal included) and the column order if new entries appeared. */
  prepare() {
    this.assembled = true;
    if (!this.symbolicStale) return false;
    const n = this.n;
    const table2 = this.slots;
    for (let i = 0; i < n; i++) if (table2.find(i, i) < 0) table2.insert(i, i);
    const count = table2.count;
    const slotRow = table2.rows, slotCol = table2.cols;
    const [rowStart, byRow, colPtr, fill, rowIdx, slotToCsc] = int32Views([n + 1, count, n + 1, n, count, count]);
    for (let s = 0; s < count; s++) {
      const r = slotRow[s] + 1;
      rowStart[r] = rowStart[r] + 1;
    }
    for (let r = 0; r < n; r++) rowStart[r + 1] = rowStart[r + 1] + rowStart[r];
    for (let s = 0; s < count; s++) {
      const r = slotRow[s];
      const at = rowStart[r];
      byRow[at] = s;
      rowStart[r] = at + 1;
    }
    for (let s = 0; s < count; s++) {
      const c = slotCol[s] + 1;
      colPtr[c] = colPtr[c] + 1;
    }
    for (let c = 0; c < n; c++) colPtr[c + 1] = colPtr[c + 1] + colPtr[c];
    fill.set(colPtr.subarray(0, n));
    for (let i = 0; i < count; i++) {
      const s = byRow[i];
      const c = slotCol[s];
      const pos = fill[c];
      fill[c] = pos + 1;
      rowIdx[pos] = slotRow[s];
      slotToCsc[s] = pos;
    }
    this.csc = { n, colPtr, rowIdx };
    this.slotToCsc = slotToCsc;
    this.order = minimumDegreeOrder(this.csc);
    this.symbolicStale = false;
    this.neverPrepared = false;
    return true;
  }
};

// src/solve/mna.ts
var GROUND = -1;
var UnknownMap = class {
  byName;
  nodeNames;
  /** Internal nodes and branches, after the external nodes. */
  extra = [];
  infoCache = null;
  pinNames;
  pinNodes;
  /** Devices ask for their pins in element order, so the next request is usually this pin. */
  nextPin = 0;
  /** The circuit's node numbering (nodeNumbering in elaborate.ts), shared and never changed. */
  constructor(numbering) {
    this.nodeNames = numbering.names;
    this.byName = numbering.index;
    this.pinNames = numbering.pinNames;
    this.pinNodes = numbering.pinNodes;
  }
  /** What each unknown is, in index order. */
  get info() {
    if (this.infoCache && this.infoCache.length === this.size) return this.infoCache;
    const info = this.nodeNames.map((name) => ({ kind: "node", name }));
    for (const e of this.extra) info.push(e);
    this.infoCache = info;
    return info;
  }
  /** External nodes are unknowns 0 .. nodeCount − 1. */
  get nodeCount() {
    return this.nodeNames.length;
  }
  /** Name of external node `index` (< nodeCount). */
  nodeName(index) {
    return this.nodeNames[index];
  }
  /** Whether unknown `index` is a branch current (else a node voltage). */
  isBranch(index) {
    return index >= this.nodeNames.length && this.extra[index - this.nodeNames.length]?.kind === "branch";
  }
  node(name) {
    const pin = this.nextPin;
    if (this.pinNames[pin] === name) {
      this.nextPin = pin + 1;
      return this.pinNodes[pin];
    }
    if (name === "0") return GROUND;
    const known = this.byName.get(name);
    if (known === void 0) throw new Error(`UnknownMap: node ${name} is not in the circuit's numbering`);
    return known;
  }
  internalNode(owner, label) {
    const index = this.size;
    this.extra.push({ kind: "internal-node", name: `${owner}#${label}`, owner });
    return index;
  }
  branch(owner) {
    const index = this.size;
    this.extra.push({ kind: "branch", name: owner, owner });
    return index;
  }
  lookup(name) {
    return name === "0" ? GROUND : this.byName.get(name);
  }
  get size() {
    return this.nodeNames.length + this.extra.length;
  }
  describe(index) {
    const info = this.info[index];
    if (!info) return `unknown ${index}`;
    if (info.kind === "node") return `node ${info.name}`;
    if (info.kind === "internal-node") return `internal node ${info.name}`;
    return `branch current of ${info.name}`;
  }
};
var PIVOT_TOLERANCE = 0.1;
var REFACTOR_TOLERANCE = 1e-3;
var RealSystem = class {
  n;
  pattern;
  values;
  rhs;
  cscValues = NO_DOUBLES;
  lu;
  /** A factorisation with the current pattern exists, so its pivot order can be re-used. */
  factored = false;
  base = NO_DOUBLES;
  baseRhs;
  /** Tape position after the constant part, where every later assembly continues. */
  baseLength = 0;
  /** The matrix the current factors are of (slot values), to skip re-factorising an unchanged one. */
  factoredValues = NO_DOUBLES;
  /**
   * Where the system's arrays, and its LU's, come from: one buffer sized for a typical circuit
   * matrix, plus `extraDoubles` for the caller's own vectors.
   */
  arena;
  /**
   * The structure of this system's first factorisation (null before it, or when it came from
   * `startFactors`), for the next system over the same circuit.
   */
  firstFactors = null;
  /** An earlier system's first factorisation, tried (and kept only if exact) before a pivot search. */
  startFactors;
  /**
   * `from`: the pattern of an earlier system over the same circuit (see firstPattern), and
   * `factors` the structure of its first factorisation (see firstFactors).
   */
  constructor(n, from, extraDoubles = 0, factors = null) {
    this.n = n;
    this.startFactors = from ? factors : null;
    this.pattern = new MatrixPattern(n, from);
    const slots = Math.max(6 * n + 16, this.pattern.slotCount);
    const entries = Math.max(16, 4 * n);
    const arena = this.arena = acquireArena(4 * n + 4 * slots + 4 * entries + extraDoubles, 8 * n + 2 * slots + 5 * entries + 16);
    this.values = arena.f64(slots);
    this.rhs = arena.f64(n);
    this.baseRhs = arena.f64(n);
    this.lu = new RealSparseLu(n, arena);
  }
  /**
   * The pattern as this system's first symbolic analysis left it (null before that, or when the
   * system started from an earlier system's snapshot), for the next system over the same circuit.
   */
  firstPattern = null;
  /**
   * Hands the arrays back for the next system (see releaseArena): the system, its LU and every
   * vector taken from `arena` are unusable afterwards.
   */
  release() {
    releaseArena(this.arena);
  }
  /** The first assembly did not replay the snapshot this system started from (see MatrixPattern.offSnapshot). */
  get offSnapshot() {
    return this.pattern.offSnapshot;
  }
  /** Starts a new assembly: clears values and right-hand side. */
  begin() {
    this.pattern.rewind();
    this.values.fill(0);
    this.rhs.fill(0);
  }
  /** Remembers what has been assembled so far (the constant part of every Newton iteration). */
  saveBase() {
    this.base = this.arena.f64(this.pattern.slotCount);
    this.base.set(this.values.subarray(0, this.pattern.slotCount));
    this.baseRhs.set(this.rhs);
    this.baseLength = this.pattern.position;
  }
  /** Starts an assembly from the saved constant part instead of from zero. */
  beginFromBase() {
    this.pattern.rewind(this.baseLength);
    this.values.fill(0);
    this.values.set(this.base);
    this.rhs.set(this.baseRhs);
  }
  add(row, col, value) {
    if (row < 0 || col < 0) return;
    const slot = this.pattern.slot(row, col);
    if (slot >= this.values.length) {
      const grown = new Float64Array(this.values.length * 2 + slot);
      grown.set(this.values);
      this.values = grown;
    }
    this.values[slot] = this.values[slot] + value;
  }
  addRhs(row, value) {
    if (row >= 0) this.rhs[row] = this.rhs[row] + value;
  }
  /** Where each slot's value goes in the LU's factor arrays; rebuilt after every factor(). */
  slotPositions = null;
  /** Factors the assembled matrix and solves into `out`. */
  solve(out) {
    const pattern = this.pattern;
    const firstAnalysis = pattern.neverPrepared;
    const symbolicChanged = pattern.prepare();
    if (firstAnalysis) this.firstPattern = pattern.snapshot();
    const count = pattern.slotCount;
    if (this.values.length < count) {
      const grown = new Float64Array(count);
      grown.set(this.values);
      this.values = grown;
    }
    const values = this.values;
    if (this.factored && !symbolicChanged) {
      if (sameValues(values, this.factoredValues, count)) {
        this.lu.solve(this.rhs, out);
        return { ok: true };
      }
      const positions = this.slotPositions ??= composePositions(this.lu.factorPositions(pattern.csc), pattern.slotToCsc, this.arena.i32(count));
      if (this.lu.refactor(pattern.csc, values, count, positions, REFACTOR_TOLERANCE)) {
        this.factoredValues.set(values.subarray(0, count));
        this.lu.solve(this.rhs, out);
        return { ok: true };
      }
    }
    if (symbolicChanged || this.cscValues.length !== count) {
      this.cscValues = this.arena.f64(count);
      this.factoredValues = this.arena.f64(count);
    }
    const start = this.startFactors;
    this.startFactors = null;
    if (start && !this.factored && !symbolicChanged) {
      const positions = this.lu.refactorAsFactor(start, pattern.csc, pattern.order, values, count, pattern.slotToCsc, PIVOT_TOLERANCE);
      if (positions) {
        this.slotPositions = positions;
        this.factored = true;
        this.factoredValues.set(values.subarray(0, count));
        this.lu.solve(this.rhs, out);
        return { ok: true };
      }
    }
    const firstFactorisation = !this.factored && this.firstFactors === null && start === null;
    const csc = this.cscValues, map = pattern.slotToCsc;
    for (let s = 0; s < count; s++) csc[map[s]] = values[s];
    this.slotPositions = null;
    const outcome = this.lu.factor(pattern.csc, csc, pattern.order, PIVOT_TOLERANCE);
    this.factored = outcome.ok;
    if (!outcome.ok) return { ok: false, singularUnknown: outcome.singularColumn };
    if (firstFactorisation) this.firstFactors = this.lu.exportStructure(pattern.csc);
    this.factoredValues.set(values.subarray(0, count));
    this.lu.solve(this.rhs, out);
    return { ok: true };
  }
  get factorNonzeros() {
    return this.lu.factorNonzeros;
  }
  get matrixNonzeros() {
    return this.pattern.slotCount;
  }
};
var ComplexSystem = class {
  n;
  pattern;
  re;
  im;
  rhsRe;
  rhsIm;
  cscRe = NO_DOUBLES;
  cscIm = NO_DOUBLES;
  lu;
  factored = false;
  slotPositions = null;
  /** The LU holds Y0 and Y1 in its factor layout for the current pivots. */
  affineLoaded = false;
  /**
   * Set by beginAt(ω) until something is stamped on top: the matrix is then exactly Y0 + ω·Y1
   * and is formed straight into the factors instead of into the slot values first.
   */
  pendingOmega = null;
  constructor(n) {
    this.n = n;
    this.pattern = new MatrixPattern(n);
    [this.re, this.im, this.rhsRe, this.rhsIm] = float64Views([6 * n + 16, 6 * n + 16, n, n]);
    this.lu = new ComplexSparseLu(n);
  }
  begin() {
    this.pattern.rewind();
    this.pendingOmega = null;
    this.re.fill(0);
    this.im.fill(0);
    this.rhsRe.fill(0);
    this.rhsIm.fill(0);
  }
  y0Re = NO_DOUBLES;
  y0Im = NO_DOUBLES;
  y1Re = NO_DOUBLES;
  y1Im = NO_DOUBLES;
  rhs0Re = NO_DOUBLES;
  rhs0Im = NO_DOUBLES;
  /**
   * Affine-in-ω assembly, Y(ω) = Y0 + ω·Y1: call after assembling at ω = 0 (which = 0), then
   * after assembling again at ω = 1 (which = 1). Afterwards beginAt(ω) starts from Y(ω), so only
   * elements that are not affine in ω need stamping per point.
   */
  saveAffinePart(which) {
    const count = this.pattern.slotCount;
    this.affineLoaded = false;
    if (which === 0) {
      this.y0Re = this.re.slice(0, count);
      this.y0Im = this.im.slice(0, count);
      this.rhs0Re = this.rhsRe.slice();
      this.rhs0Im = this.rhsIm.slice();
      return;
    }
    const y0Re = new Float64Array(count), y0Im = new Float64Array(count);
    y0Re.set(this.y0Re.subarray(0, count));
    y0Im.set(this.y0Im.subarray(0, count));
    this.y0Re = y0Re;
    this.y0Im = y0Im;
    this.y1Re = new Float64Array(count);
    this.y1Im = new Float64Array(count);
    for (let s = 0; s < count; s++) {
      this.y1Re[s] = this.re[s] - y0Re[s];
      this.y1Im[s] = this.im[s] - y0Im[s];
    }
  }
  beginAt(omega) {
    this.pattern.rewind();
    this.pendingOmega = omega;
    this.rhsRe.set(this.rhs0Re);
    this.rhsIm.set(this.rhs0Im);
  }
  /** Writes Y0 + ω·Y1 into the slot values, for stamps on top or a full factorisation. */
  materialise() {
    const omega = this.pendingOmega;
    if (omega === null) return;
    this.pendingOmega = null;
    const re = this.re, im = this.im, y0r = this.y0Re, y0i = this.y0Im, y1r = this.y1Re, y1i = this.y1Im;
    const count = y1r.length;
    for (let s = 0; s < count; s++) {
      re[s] = y0r[s] + omega * y1r[s];
      im[s] = y0i[s] + omega * y1i[s];
    }
    re.fill(0, count);
    im.fill(0, count);
  }
  add(row, col, re, im) {
    if (row < 0 || col < 0) return;
    if (this.pendingOmega !== null) this.materialise();
    const slot = this.pattern.slot(row, col);
    if (slot >= this.re.length) {
      const size = this.re.length * 2 + slot;
      const gr = new Float64Array(size);
      gr.set(this.re);
      this.re = gr;
      const gi = new Float64Array(size);
      gi.set(this.im);
      this.im = gi;
    }
    this.re[slot] = this.re[slot] + re;
    this.im[slot] = this.im[slot] + im;
  }
  addRhs(row, re, im) {
    if (row < 0) return;
    this.rhsRe[row] = this.rhsRe[row] + re;
    this.rhsIm[row] = this.rhsIm[row] + im;
  }
  solve(outRe, outIm) {
    const pattern = this.pattern;
    const symbolicChanged = pattern.prepare();
    const count = pattern.slotCount;
    if (this.re.length < count) {
      const gr = new Float64Array(count);
      gr.set(this.re);
      this.re = gr;
      const gi = new Float64Array(count);
      gi.set(this.im);
      this.im = gi;
    }
    if (this.factored && !symbolicChanged) {
      const positions = this.slotPositions ??= composePositions(this.lu.factorPositions(pattern.csc), pattern.slotToCsc);
      const omega = this.pendingOmega;
      let ok;
      if (omega !== null && this.y1Re.length === count) {
        if (!this.affineLoaded) {
          this.lu.loadAffine(pattern.csc, this.y0Re, this.y0Im, this.y1Re, this.y1Im, count, positions);
          this.affineLoaded = true;
        }
        ok = this.lu.refactorAffine(omega, REFACTOR_TOLERANCE);
      } else {
        this.materialise();
        ok = this.lu.refactor(pattern.csc, this.re, this.im, count, positions, REFACTOR_TOLERANCE);
      }
      if (ok) {
        this.lu.solve(this.rhsRe, this.rhsIm, outRe, outIm);
        return { ok: true };
      }
    }
    this.materialise();
    if (symbolicChanged || this.cscRe.length !== count) {
      this.cscRe = new Float64Array(count);
      this.cscIm = new Float64Array(count);
    }
    const cr = this.cscRe, ci = this.cscIm, map = pattern.slotToCsc, re = this.re, im = this.im;
    for (let s = 0; s < count; s++) {
      const p = map[s];
      cr[p] = re[s];
      ci[p] = im[s];
    }
    this.slotPositions = null;
    this.affineLoaded = false;
    const outcome = this.lu.factor(pattern.csc, cr, ci, pattern.order, PIVOT_TOLERANCE);
    this.factored = outcome.ok;
    if (!outcome.ok) return { ok: false, singularUnknown: outcome.singularColumn };
    this.lu.solve(this.rhsRe, this.rhsIm, outRe, outIm);
    return { ok: true };
  }
  /**
   * Two points of a sweep whose matrix is exactly Y0 + ω·Y1 (nothing stamped per point), solved
   * together with the current pivots; false, with nothing written, when that is not possible
   * (no factorisation yet, new entries, or a pivot that needs a fresh search) — the caller then
   * takes the two points through beginAt/solve one at a time. The caller must not have
   * per-point stamps.
   */
  solveAffinePair(omegaA, omegaB, aRe, aIm, bRe, bIm) {
    const pattern = this.pattern, count = pattern.slotCount;
    if (!this.factored || pattern.stale || this.y1Re.length !== count) return false;
    const positions = this.slotPositions ??= composePositions(this.lu.factorPositions(pattern.csc), pattern.slotToCsc);
    if (!this.affineLoaded) {
      this.lu.loadAffine(pattern.csc, this.y0Re, this.y0Im, this.y1Re, this.y1Im, count, positions);
      this.affineLoaded = true;
    }
    if (!this.lu.refactorAffinePair(omegaA, omegaB, REFACTOR_TOLERANCE)) return false;
    this.lu.solvePair(this.rhs0Re, this.rhs0Im, aRe, aIm, bRe, bIm);
    return true;
  }
  get factorNonzeros() {
    return this.lu.factorNonzeros;
  }
  get matrixNonzeros() {
    return this.pattern.slotCount;
  }
};
function sameValues(a, b, count) {
  if (b.length < count) return false;
  for (let i = 0; i < count; i++) if (a[i] !== b[i]) return false;
  return true;
}
function composePositions(cscToFactor, slotToCsc, out = new Int32Array(slotToCsc.length)) {
  for (let s = 0; s < out.length; s++) out[s] = cscToFactor[slotToCsc[s]];
  return out;
}

// src/solve/stamp.ts
var RealStamper = class {
  constructor(system) {
    this.system = system;
  }
  system;
  conductance(a, b, g) {
    const s = this.system;
    s.add(a, a, g);
    s.add(b, b, g);
    s.add(a, b, -g);
    s.add(b, a, -g);
  }
  transconductance(p, n, cp, cn, g) {
    const s = this.system;
    s.add(p, cp, g);
    s.add(p, cn, -g);
    s.add(n, cp, -g);
    s.add(n, cn, g);
  }
  current(p, n, amps) {
    this.system.addRhs(p, -amps);
    this.system.addRhs(n, amps);
  }
  entry(row, col, value) {
    this.system.add(row, col, value);
  }
  rhs(row, value) {
    this.system.addRhs(row, value);
  }
};
var ComplexStamper = class {
  constructor(system) {
    this.system = system;
  }
  system;
  admittance(a, b, re, im) {
    const s = this.system;
    s.add(a, a, re, im);
    s.add(b, b, re, im);
    s.add(a, b, -re, -im);
    s.add(b, a, -re, -im);
  }
  transadmittance(p, n, cp, cn, re, im) {
    const s = this.system;
    s.add(p, cp, re, im);
    s.add(p, cn, -re, -im);
    s.add(n, cp, -re, -im);
    s.add(n, cn, re, im);
  }
  current(p, n, re, im) {
    this.system.addRhs(p, -re, -im);
    this.system.addRhs(n, re, im);
  }
  entry(row, col, re, im) {
    this.system.add(row, col, re, im);
  }
  rhs(row, re, im) {
    this.system.addRhs(row, re, im);
  }
};
function voltageOf(x, node) {
  return node < 0 ? 0 : x[node];
}

// src/solve/models/junction.ts
var BOLTZMANN = 138064852e-31;
var ELEMENTARY_CHARGE = 16021766208e-29;
var ANALYSIS_TEMPERATURE = 300.15;
var THERMAL_VOLTAGE = BOLTZMANN * ANALYSIS_TEMPERATURE / ELEMENTARY_CHARGE;
function junctionCurrent(v, isat, vte, out) {
  if (isat === 0) {
    out.i = 0;
    out.g = 0;
  } else if (v >= -3 * vte) {
    const e = Math.exp(Math.min(v / vte, 700));
    out.i = isat * (e - 1);
    out.g = isat * e / vte;
  } else {
    let arg = 3 * vte / (v * Math.E);
    arg = arg * arg * arg;
    out.i = -isat * (1 + arg);
    out.g = isat * 3 * arg / v;
  }
  return out;
}
function depletionCapacitance(v, cj0, vj, m, fc) {
  if (cj0 === 0) return 0;
  if (v < fc * vj) return cj0 * Math.pow(1 - v / vj, -m);
  const f2 = Math.pow(1 - fc, 1 + m);
  const f3 = 1 - fc * (1 + m);
  return cj0 / f2 * (f3 + m * v / vj);
}
function criticalVoltage(isat, vte) {
  if (isat <= 0) return Infinity;
  return vte * Math.log(vte / (Math.SQRT2 * isat));
}
function pnjlim(vnew, vold, vt, vcrit, flag) {
  if (vnew > vcrit && Math.abs(vnew - vold) > vt + vt) {
    flag.limited = true;
    if (vold > 0) {
      const arg = 1 + (vnew - vold) / vt;
      return arg > 0 ? vold + vt * Math.log(arg) : vcrit;
    }
    return vt * Math.log(vnew / vt);
  }
  if (vnew < 0) {
    const floor = vold > 0 ? -1 - vold : 2 * vold - 1;
    if (vnew < floor) {
      flag.limited = true;
      return floor;
    }
  }
  return vnew;
}
function fetlim(vnew, vold, vto) {
  const vtsthi = Math.abs(2 * (vold - vto)) + 2;
  const vtstlo = vtsthi / 2 + 2;
  const vtox = vto + 3.5;
  const delv = vnew - vold;
  if (vold >= vto) {
    if (vold >= vtox) {
      if (delv <= 0) {
        if (vnew >= vtox) {
          if (-delv > vtstlo) return vold - vtstlo;
        } else {
          return Math.max(vnew, vto + 2);
        }
      } else if (delv >= vtsthi) {
        return vold + vtsthi;
      }
    } else if (delv <= 0) {
      return Math.max(vnew, vto - 0.5);
    } else {
      return Math.min(vnew, vto + 4);
    }
  } else if (delv <= 0) {
    if (-delv > vtsthi) return vold - vtsthi;
  } else {
    const vtemp = vto + 0.5;
    if (vnew <= vtemp) {
      if (delv > vtstlo) return vold + vtstlo;
    } else {
      return vtemp;
    }
  }
  return vnew;
}
function limvds(vnew, vold) {
  if (vold >= 3.5) {
    if (vnew > vold) return Math.min(vnew, 3 * vold + 2);
    if (vnew < 3.5) return Math.max(vnew, 2);
    return vnew;
  }
  if (vnew > vold) return Math.min(vnew, 4);
  return Math.max(vnew, -0.5);
}

// src/solve/models/params.ts
var resolvedCache = /* @__PURE__ */ new WeakMap();
function stillMatches(card, seen) {
  let count = 0;
  for (const key in card.params) {
    const entry = seen[count++];
    if (!entry || entry[0] !== key || !Object.is(entry[1], card.params[key])) return false;
  }
  return count === seen.length;
}
function resolveParams(card, table2) {
  let perCard = resolvedCache.get(table2);
  if (!perCard) resolvedCache.set(table2, perCard = /* @__PURE__ */ new WeakMap());
  const cached = perCard.get(card);
  if (cached && stillMatches(card, cached.seen)) return cached.resolved;
  const resolved = {};
  for (const spec of table2) resolved[spec.name] = spec.default;
  const seen = [];
  for (const key in card.params) {
    const given = card.params[key];
    seen.push([key, given]);
    const name = key.toUpperCase();
    if (given !== void 0 && Number.isFinite(given) && name in resolved) resolved[name] = given;
  }
  const frozen = Object.freeze(resolved);
  perCard.set(card, { seen, resolved: frozen });
  return frozen;
}
function isGiven(card, name) {
  for (const key in card.params) {
    const v = card.params[key];
    if (key.toUpperCase() === name && v !== void 0 && Number.isFinite(v)) return true;
  }
  return false;
}
function param(p, name) {
  const v = p[name];
  if (v === void 0) throw new Error(`model parameter ${name} missing from its table`);
  return v;
}
function inverseOrZero(value) {
  return value === 0 || !Number.isFinite(value) ? 0 : 1 / value;
}

// src/solve/models/bjt.ts
var BJT_PARAMS = [
  { name: "IS", default: 1e-16, unit: "A", description: "transport saturation current" },
  { name: "BF", default: 100, unit: "", description: "ideal maximum forward beta" },
  { name: "NF", default: 1, unit: "", description: "forward emission coefficient" },
  { name: "VAF", default: Infinity, unit: "V", description: "forward Early voltage" },
  { name: "IKF", default: Infinity, unit: "A", description: "forward beta high-current roll-off knee" },
  { name: "ISE", default: 0, unit: "A", description: "base-emitter leakage saturation current" },
  { name: "NE", default: 1.5, unit: "", description: "base-emitter leakage emission coefficient" },
  { name: "BR", default: 1, unit: "", description: "ideal maximum reverse beta" },
  { name: "NR", default: 1, unit: "", description: "reverse emission coefficient" },
  { name: "VAR", default: Infinity, unit: "V", description: "reverse Early voltage" },
  { name: "IKR", default: Infinity, unit: "A", description: "reverse beta roll-off knee" },
  { name: "ISC", default: 0, unit: "A", description: "base-collector leakage saturation current" },
  { name: "NC", default: 2, unit: "", description: "base-collector leakage emission coefficient" },
  { name: "RB", default: 0, unit: "\u03A9", description: "base resistance" },
  { name: "RE", default: 0, unit: "\u03A9", description: "emitter resistance" },
  { name: "RC", default: 0, unit: "\u03A9", description: "collector resistance" },
  { name: "CJE", default: 0, unit: "F", description: "base-emitter zero-bias depletion capacitance" },
  { name: "VJE", default: 0.75, unit: "V", description: "base-emitter built-in potential" },
  { name: "MJE", default: 0.33, unit: "", description: "base-emitter junction grading" },
  { name: "CJC", default: 0, unit: "F", description: "base-collector zero-bias depletion capacitance" },
  { name: "VJC", default: 0.75, unit: "V", description: "base-collector built-in potential" },
  { name: "MJC", default: 0.33, unit: "", description: "base-collector junction grading" },
  { name: "XCJC", default: 1, unit: "", description: "fraction of CJC at the internal base" },
  { name: "FC", default: 0.5, unit: "", description: "forward-bias depletion capacitance coefficient" },
  { name: "TF", default: 0, unit: "s", description: "ideal forward transit time" },
  { name: "XTF", default: 0, unit: "", description: "TF bias-dependence coefficient" },
  { name: "VTF", default: Infinity, unit: "V", description: "TF dependence on VBC" },
  { name: "ITF", default: 0, unit: "A", description: "TF high-current parameter" },
  { name: "TR", default: 0, unit: "s", description: "ideal reverse transit time" }
];
function bjtConstants(el) {
  const p = resolveParams(el.model, BJT_PARAMS);
  const area = el.area ?? 1;
  const isat = param(p, "IS") * area;
  const rb = param(p, "RB") / area;
  const rc = param(p, "RC") / area;
  const re = param(p, "RE") / area;
  const cjc = param(p, "CJC") * area;
  const xcjc = Math.min(1, Math.max(0, param(p, "XCJC")));
  const vtfParam = param(p, "VTF");
  return {
    polarity: el.model.type === "PNP" ? -1 : 1,
    isat,
    bf: param(p, "BF"),
    br: param(p, "BR"),
    vtf: param(p, "NF") * THERMAL_VOLTAGE,
    vtr: param(p, "NR") * THERMAL_VOLTAGE,
    invVaf: inverseOrZero(param(p, "VAF")),
    invVar: inverseOrZero(param(p, "VAR")),
    invIkf: inverseOrZero(param(p, "IKF") * area),
    invIkr: inverseOrZero(param(p, "IKR") * area),
    ise: param(p, "ISE") * area,
    vte: param(p, "NE") * THERMAL_VOLTAGE,
    isc: param(p, "ISC") * area,
    vtc: param(p, "NC") * THERMAL_VOLTAGE,
    gx: rb > 0 ? 1 / rb : 0,
    gc: rc > 0 ? 1 / rc : 0,
    ge: re > 0 ? 1 / re : 0,
    vcrit: criticalVoltage(isat, THERMAL_VOLTAGE),
    cje: param(p, "CJE") * area,
    vje: param(p, "VJE"),
    mje: param(p, "MJE"),
    cjcInternal: cjc * xcjc,
    cjcExternal: cjc * (1 - xcjc),
    vjc: param(p, "VJC"),
    mjc: param(p, "MJC"),
    fc: param(p, "FC"),
    tf: param(p, "TF"),
    xtf: param(p, "XTF"),
    invVtf144: vtfParam === 0 || !Number.isFinite(vtfParam) ? 0 : 1 / (1.44 * vtfParam),
    itf: param(p, "ITF") * area,
    tr: param(p, "TR")
  };
}
function evaluate(k, vbe, vbc, gmin, s, j) {
  junctionCurrent(vbe, k.isat, k.vtf, j);
  const cbe = j.i, gbe = j.g;
  junctionCurrent(vbe, k.ise, k.vte, j);
  const cben = j.i + gmin * vbe, gben = j.g + gmin;
  junctionCurrent(vbc, k.isat, k.vtr, j);
  const cbc = j.i, gbc = j.g;
  junctionCurrent(vbc, k.isc, k.vtc, j);
  const cbcn = j.i + gmin * vbc, gbcn = j.g + gmin;
  const q1 = 1 / (1 - k.invVaf * vbc - k.invVar * vbe);
  let qb, dqbdve, dqbdvc;
  if (k.invIkf === 0 && k.invIkr === 0) {
    qb = q1;
    dqbdve = q1 * qb * k.invVar;
    dqbdvc = q1 * qb * k.invVaf;
  } else {
    const q2 = k.invIkf * cbe + k.invIkr * cbc;
    const arg = Math.max(0, 1 + 4 * q2);
    const sqarg = arg !== 0 ? Math.sqrt(arg) : 1;
    qb = q1 * (1 + sqarg) / 2;
    dqbdve = q1 * (qb * k.invVar + k.invIkf * gbe / sqarg);
    dqbdvc = q1 * (qb * k.invVaf + k.invIkr * gbc / sqarg);
  }
  s.vbe = vbe;
  s.vbc = vbc;
  s.cc = (cbe - cbc) / qb - cbc / k.br - cbcn;
  s.cb = cbe / k.bf + cben + cbc / k.br + cbcn;
  s.gpi = gbe / k.bf + gben;
  s.gmu = gbc / k.br + gbcn;
  s.go = (gbc + (cbe - cbc) * dqbdvc / qb) / qb;
  s.gm = (gbe - (cbe - cbc) * dqbdve / qb) / qb - s.go;
  s.cbeIdeal = cbe;
  s.gbeIdeal = gbe;
  s.cbcIdeal = cbc;
  s.gbcIdeal = gbc;
  s.qb = qb;
  s.dqbdve = dqbdve;
  s.dqbdvc = dqbdvc;
}
function capacitances(k, s, vbx) {
  let diffBe = 0;
  let geqcb = 0;
  if (k.tf !== 0 && s.vbe > 0) {
    let argtf = 0, arg2 = 0, arg3 = 0;
    if (k.xtf !== 0) {
      argtf = k.xtf;
      if (k.invVtf144 !== 0) argtf *= Math.exp(s.vbc * k.invVtf144);
      arg2 = argtf;
      if (k.itf !== 0) {
        const temp = s.cbeIdeal / (s.cbeIdeal + k.itf);
        argtf *= temp * temp;
        arg2 = argtf * (3 - temp - temp);
      }
      arg3 = s.cbeIdeal * argtf * k.invVtf144;
    }
    const cbeq = s.cbeIdeal * (1 + argtf) / s.qb;
    const gbeq = (s.gbeIdeal * (1 + arg2) - cbeq * s.dqbdve) / s.qb;
    geqcb = k.tf * (arg3 - cbeq * s.dqbdvc) / s.qb;
    diffBe = k.tf * gbeq;
  } else {
    diffBe = k.tf * s.gbeIdeal;
  }
  return {
    capbe: diffBe + depletionCapacitance(s.vbe, k.cje, k.vje, k.mje, k.fc),
    capbc: k.tr * s.gbcIdeal + depletionCapacitance(s.vbc, k.cjcInternal, k.vjc, k.mjc, k.fc),
    capbx: depletionCapacitance(vbx, k.cjcExternal, k.vjc, k.mjc, k.fc),
    geqcb
  };
}
var ON_CURRENT = 1e-7;
var SATURATION_RATIO = 1e-4;
function region(s, area) {
  const beOn = s.cbeIdeal > ON_CURRENT * area;
  const bcOn = s.cbcIdeal > ON_CURRENT * area;
  if (beOn && s.cbcIdeal > SATURATION_RATIO * s.cbeIdeal && s.vbc > 0) return "saturation";
  if (beOn) return "active";
  if (bcOn) return "reverse";
  return "cut-off";
}
function bjtDevice(el, unknowns, memo) {
  const k = memo ? memo.derived(BJT_PARAMS, el.model, el.area ?? 1, () => bjtConstants(el)) : bjtConstants(el);
  const c = unknowns.node(el.c);
  const b = unknowns.node(el.b);
  const e = unknowns.node(el.e);
  const cp = k.gc > 0 ? unknowns.internalNode(el.name, "collector") : c;
  const bp = k.gx > 0 ? unknowns.internalNode(el.name, "base") : b;
  const ep = k.ge > 0 ? unknowns.internalNode(el.name, "emitter") : e;
  const t = k.polarity;
  const scratch = { i: 0, g: 0 };
  const s = {
    vbe: 0,
    vbc: 0,
    vbx: 0,
    cc: 0,
    cb: 0,
    gpi: 0,
    gmu: 0,
    gm: 0,
    go: 0,
    cbeIdeal: 0,
    gbeIdeal: 0,
    cbcIdeal: 0,
    gbcIdeal: 0,
    qb: 1,
    dqbdve: 0,
    dqbdvc: 0
  };
  let caps = null;
  const stampOhmic = (stamp) => {
    if (k.gc > 0) stamp.conductance(c, cp, k.gc);
    if (k.gx > 0) stamp.conductance(b, bp, k.gx);
    if (k.ge > 0) stamp.conductance(e, ep, k.ge);
  };
  const stampOhmicAc = (stamp) => {
    if (k.gc > 0) stamp.admittance(c, cp, k.gc, 0);
    if (k.gx > 0) stamp.admittance(b, bp, k.gx, 0);
    if (k.ge > 0) stamp.admittance(e, ep, k.ge, 0);
  };
  return {
    name: el.name,
    active: true,
    nodes: [c, b, e],
    acAffine: true,
    loadDc(x, stamp, ctx) {
      let vbe, vbc;
      if (ctx.mode === "init-junction") {
        vbe = k.vcrit;
        vbc = 0;
      } else {
        vbe = t * (voltageOf(x, bp) - voltageOf(x, ep));
        vbc = t * (voltageOf(x, bp) - voltageOf(x, cp));
        if (ctx.mode === "normal") {
          vbe = pnjlim(vbe, s.vbe, THERMAL_VOLTAGE, k.vcrit, ctx);
          vbc = pnjlim(vbc, s.vbc, THERMAL_VOLTAGE, k.vcrit, ctx);
        }
      }
      s.vbx = t * (voltageOf(x, b) - voltageOf(x, cp));
      evaluate(k, vbe, vbc, ctx.gmin, s, scratch);
      caps = null;
      stampOhmic(stamp);
      const dccDvbe = s.gm + s.go;
      const dccDvbc = -(s.go + s.gmu);
      stamp.transconductance(cp, ep, bp, ep, dccDvbe);
      stamp.transconductance(cp, ep, bp, cp, dccDvbc);
      stamp.current(cp, ep, t * (s.cc - dccDvbe * vbe - dccDvbc * vbc));
      stamp.transconductance(bp, ep, bp, ep, s.gpi);
      stamp.transconductance(bp, ep, bp, cp, s.gmu);
      stamp.current(bp, ep, t * (s.cb - s.gpi * vbe - s.gmu * vbc));
    },
    converged(x) {
      const dvbe = t * (voltageOf(x, bp) - voltageOf(x, ep)) - s.vbe;
      const dvbc = t * (voltageOf(x, bp) - voltageOf(x, cp)) - s.vbc;
      const ccHat = s.cc + (s.gm + s.go) * dvbe - (s.go + s.gmu) * dvbc;
      const cbHat = s.cb + s.gpi * dvbe + s.gmu * dvbc;
      return currentSettled(ccHat, s.cc) && currentSettled(cbHat, s.cb);
    },
    loadAc(stamp, ctx) {
      const w = ctx.omega;
      const cap = caps ??= capacitances(k, s, s.vbx);
      stampOhmicAc(stamp);
      stamp.transadmittance(cp, ep, bp, ep, s.gm + s.go, 0);
      stamp.transadmittance(cp, ep, bp, cp, -(s.go + s.gmu), 0);
      stamp.transadmittance(bp, ep, bp, ep, s.gpi, 0);
      stamp.transadmittance(bp, ep, bp, cp, s.gmu, 0);
      stamp.admittance(bp, ep, 0, w * cap.capbe);
      stamp.admittance(bp, cp, 0, w * cap.capbc);
      if (cap.capbx !== 0) stamp.admittance(b, cp, 0, w * cap.capbx);
      if (cap.geqcb !== 0) stamp.transadmittance(bp, ep, bp, cp, 0, w * cap.geqcb);
    },
    report(x) {
      const vc = voltageOf(x, c), vb = voltageOf(x, b), ve = voltageOf(x, e);
      const icIn = t * s.cc;
      const ibIn = t * s.cb;
      const cap = caps ??= capacitances(k, s, s.vbx);
      return {
        kind: "bjt",
        type: t === 1 ? "npn" : "pnp",
        region: region(s, el.area ?? 1),
        vbe: t * (vb - ve),
        vce: t * (vc - ve),
        vcb: t * (vc - vb),
        ic: s.cc,
        ib: s.cb,
        ie: s.cc + s.cb,
        power: vc * icIn + vb * ibIn - ve * (icIn + ibIn),
        gm: s.gm,
        gpi: s.gpi,
        gmu: s.gmu,
        go: s.go,
        gx: k.gx,
        cpi: cap.capbe,
        cmu: cap.capbc,
        vbeInternal: s.vbe,
        vbcInternal: s.vbc
      };
    }
  };
}

// src/solve/models/diode.ts
var DIODE_PARAMS = [
  { name: "IS", default: 1e-14, unit: "A", description: "saturation current" },
  { name: "N", default: 1, unit: "", description: "emission coefficient" },
  { name: "RS", default: 0, unit: "\u03A9", description: "series resistance" },
  { name: "BV", default: Infinity, unit: "V", description: "reverse breakdown voltage" },
  { name: "IBV", default: 1e-3, unit: "A", description: "current at the breakdown voltage" },
  { name: "NBV", default: NaN, unit: "", description: "breakdown emission coefficient (defaults to N)" },
  { name: "CJO", default: 0, unit: "F", description: "zero-bias junction capacitance" },
  { name: "VJ", default: 1, unit: "V", description: "junction potential" },
  { name: "M", default: 0.5, unit: "", description: "grading coefficient" },
  { name: "FC", default: 0.5, unit: "", description: "forward-bias depletion capacitance coefficient" },
  { name: "TT", default: 0, unit: "s", description: "transit time" }
];
function effectiveBreakdown(bv, ibv, isat, vtb) {
  if (ibv < isat * bv / vtb) return bv;
  const tol = 1e-3 * ibv;
  let xbv = bv - vtb * Math.log(1 + ibv / isat);
  for (let iter = 0; iter < 25; iter++) {
    xbv = bv - vtb * Math.log(ibv / isat + 1 - xbv / vtb);
    const xcbv = isat * (Math.exp((bv - xbv) / vtb) - 1 + xbv / vtb);
    if (Math.abs(xcbv - ibv) <= tol) break;
  }
  return xbv;
}
function diodeConstants(el) {
  const p = resolveParams(el.model, DIODE_PARAMS);
  const area = el.area ?? 1;
  const isat = param(p, "IS") * area;
  const vte = param(p, "N") * THERMAL_VOLTAGE;
  const nbv = Number.isFinite(param(p, "NBV")) ? param(p, "NBV") : param(p, "N");
  const vteBreakdown = nbv * THERMAL_VOLTAGE;
  const rs = param(p, "RS") / area;
  const bvGiven = isGiven(el.model, "BV") && param(p, "BV") > 0;
  return {
    isat,
    vte,
    vteBreakdown,
    vcrit: criticalVoltage(isat, vte),
    bv: bvGiven ? effectiveBreakdown(param(p, "BV"), param(p, "IBV") * area, isat, vteBreakdown) : Infinity,
    gs: rs > 0 ? 1 / rs : 0,
    cj0: param(p, "CJO") * area,
    vj: param(p, "VJ"),
    m: param(p, "M"),
    fc: param(p, "FC"),
    tt: param(p, "TT")
  };
}
function diodeCurrent(vd, k, out) {
  if (vd >= -3 * k.vte || vd >= -k.bv) return junctionCurrent(vd, k.isat, k.vte, out);
  const e = Math.exp(Math.min(-(k.bv + vd) / k.vteBreakdown, 700));
  out.i = -k.isat * e;
  out.g = k.isat * e / k.vteBreakdown;
  return out;
}
function diodeDevice(el, unknowns, memo) {
  const k = memo ? memo.derived(DIODE_PARAMS, el.model, el.area ?? 1, () => diodeConstants(el)) : diodeConstants(el);
  const anode = unknowns.node(el.anode);
  const cathode = unknowns.node(el.cathode);
  const junctionAnode = k.gs > 0 ? unknowns.internalNode(el.name, "anode") : anode;
  const scratch = { i: 0, g: 0 };
  const state = { vd: 0, id: 0, gd: 0 };
  let cap = null;
  const capacitance = () => cap ??= depletionCapacitance(state.vd, k.cj0, k.vj, k.m, k.fc) + k.tt * state.gd;
  const limitedVoltage = (vd, ctx) => {
    if (ctx.mode !== "normal") return vd;
    if (Number.isFinite(k.bv) && vd < Math.min(0, -k.bv + 10 * k.vteBreakdown)) {
      const mirrored = pnjlim(-(vd + k.bv), -(state.vd + k.bv), k.vteBreakdown, k.vcrit, ctx);
      return -(mirrored + k.bv);
    }
    return pnjlim(vd, state.vd, k.vte, k.vcrit, ctx);
  };
  return {
    name: el.name,
    active: true,
    nodes: [anode, cathode],
    acAffine: true,
    loadDc(x, stamp, ctx) {
      let vd = ctx.mode === "init-junction" ? k.vcrit : voltageOf(x, junctionAnode) - voltageOf(x, cathode);
      if (!Number.isFinite(vd)) vd = 0;
      vd = limitedVoltage(vd, ctx);
      diodeCurrent(vd, k, scratch);
      const gd = scratch.g + ctx.gmin;
      const id = scratch.i + ctx.gmin * vd;
      state.vd = vd;
      state.id = id;
      state.gd = gd;
      cap = null;
      if (k.gs > 0) stamp.conductance(anode, junctionAnode, k.gs);
      stamp.conductance(junctionAnode, cathode, gd);
      stamp.current(junctionAnode, cathode, id - gd * vd);
    },
    converged(x) {
      const vd = voltageOf(x, junctionAnode) - voltageOf(x, cathode);
      return currentSettled(state.id + state.gd * (vd - state.vd), state.id);
    },
    loadAc(stamp, ctx) {
      if (k.gs > 0) stamp.admittance(anode, junctionAnode, k.gs, 0);
      stamp.admittance(junctionAnode, cathode, state.gd, ctx.omega * capacitance());
    },
    report(x) {
      const vd = voltageOf(x, anode) - voltageOf(x, cathode);
      const region2 = state.vd >= 0 ? "forward" : Number.isFinite(k.bv) && state.vd < -k.bv + 3 * k.vteBreakdown ? "breakdown" : "reverse";
      return {
        kind: "diode",
        region: region2,
        vd,
        id: state.id,
        power: vd * state.id,
        gd: state.gd,
        cd: capacitance()
      };
    }
  };
}

// src/solve/models/jfet.ts
var JFET_PARAMS = [
  { name: "VTO", default: -2, unit: "V", description: "threshold (pinch-off) voltage" },
  { name: "BETA", default: 1e-4, unit: "A/V\xB2", description: "transconductance parameter (IDSS = BETA\xB7VTO\xB2)" },
  { name: "LAMBDA", default: 0, unit: "1/V", description: "channel-length modulation" },
  { name: "RD", default: 0, unit: "\u03A9", description: "drain ohmic resistance" },
  { name: "RS", default: 0, unit: "\u03A9", description: "source ohmic resistance" },
  { name: "CGS", default: 0, unit: "F", description: "zero-bias gate-source junction capacitance" },
  { name: "CGD", default: 0, unit: "F", description: "zero-bias gate-drain junction capacitance" },
  { name: "PB", default: 1, unit: "V", description: "gate junction potential" },
  { name: "IS", default: 1e-14, unit: "A", description: "gate junction saturation current" },
  { name: "N", default: 1, unit: "", description: "gate junction emission coefficient" },
  { name: "FC", default: 0.5, unit: "", description: "forward-bias depletion capacitance coefficient" },
  { name: "M", default: 0.5, unit: "", description: "gate junction grading coefficient" }
];
function jfetConstants(el) {
  const p = resolveParams(el.model, JFET_PARAMS);
  const area = el.area ?? 1;
  const rd = param(p, "RD") / area;
  const rs = param(p, "RS") / area;
  const isat = param(p, "IS") * area;
  const vtGate = param(p, "N") * THERMAL_VOLTAGE;
  return {
    polarity: el.model.type === "PJF" ? -1 : 1,
    vto: param(p, "VTO"),
    beta: param(p, "BETA") * area,
    lambda: param(p, "LAMBDA"),
    gd: rd > 0 ? 1 / rd : 0,
    gs: rs > 0 ? 1 / rs : 0,
    isat,
    vtGate,
    vcrit: criticalVoltage(isat, THERMAL_VOLTAGE),
    cgs: param(p, "CGS") * area,
    cgd: param(p, "CGD") * area,
    pb: param(p, "PB"),
    m: param(p, "M"),
    fc: param(p, "FC")
  };
}
function channel(k, vgs, vgd, s) {
  const vds = vgs - vgd;
  if (vds >= 0) {
    const vgst = vgs - k.vto;
    if (vgst <= 0) {
      s.ids = 0;
      s.gm = 0;
      s.gds = 0;
    } else {
      const betap = k.beta * (1 + k.lambda * vds);
      const twob = betap + betap;
      if (vgst <= vds) {
        s.ids = betap * vgst * vgst;
        s.gm = twob * vgst;
        s.gds = k.lambda * k.beta * vgst * vgst;
      } else {
        s.ids = betap * vds * (vgst + vgst - vds);
        s.gm = twob * vds;
        s.gds = twob * (vgst - vds) + k.lambda * k.beta * vds * (vgst + vgst - vds);
      }
    }
  } else {
    const vgdt = vgd - k.vto;
    if (vgdt <= 0) {
      s.ids = 0;
      s.gm = 0;
      s.gds = 0;
    } else {
      const betap = k.beta * (1 - k.lambda * vds);
      const twob = betap + betap;
      if (vgdt <= -vds) {
        s.ids = -betap * vgdt * vgdt;
        s.gm = -twob * vgdt;
        s.gds = k.beta * k.lambda * vgdt * vgdt - s.gm;
      } else {
        s.ids = betap * vds * (vgdt + vgdt + vds);
        s.gm = twob * vds;
        s.gds = twob * vgdt - k.beta * k.lambda * vds * (vgdt + vgdt + vds);
      }
    }
  }
}
function jfetRegion(k, vgs, vgd) {
  const vds = vgs - vgd;
  const vgst = (vds >= 0 ? vgs : vgd) - k.vto;
  if (vgst <= 0) return "cut-off";
  return vgst <= Math.abs(vds) ? "saturation" : "triode";
}
function jfetDevice(el, unknowns, memo) {
  const k = memo ? memo.derived(JFET_PARAMS, el.model, el.area ?? 1, () => jfetConstants(el)) : jfetConstants(el);
  const d = unknowns.node(el.d);
  const g = unknowns.node(el.g);
  const src = unknowns.node(el.s);
  const dp = k.gd > 0 ? unknowns.internalNode(el.name, "drain") : d;
  const sp = k.gs > 0 ? unknowns.internalNode(el.name, "source") : src;
  const t = k.polarity;
  const j = { i: 0, g: 0 };
  const s = { vgs: 0, vgd: 0, ids: 0, gm: 0, gds: 0, cgsDiode: 0, ggs: 0, cgdDiode: 0, ggd: 0 };
  let caps = null;
  const capacitances2 = () => caps ??= { cgs: depletionCapacitance(s.vgs, k.cgs, k.pb, k.m, k.fc), cgd: depletionCapacitance(s.vgd, k.cgd, k.pb, k.m, k.fc) };
  return {
    name: el.name,
    active: true,
    nodes: [d, g, src],
    acAffine: true,
    loadDc(x, stamp, ctx) {
      let vgs, vgd;
      if (ctx.mode === "init-junction") {
        vgs = -1;
        vgd = -1;
      } else {
        vgs = t * (voltageOf(x, g) - voltageOf(x, sp));
        vgd = t * (voltageOf(x, g) - voltageOf(x, dp));
        if (ctx.mode === "normal") {
          vgs = pnjlim(vgs, s.vgs, THERMAL_VOLTAGE, k.vcrit, ctx);
          vgd = pnjlim(vgd, s.vgd, THERMAL_VOLTAGE, k.vcrit, ctx);
          const vgsLimited = fetlim(vgs, s.vgs, k.vto);
          const vgdLimited = fetlim(vgd, s.vgd, k.vto);
          if (vgsLimited !== vgs || vgdLimited !== vgd) ctx.limited = true;
          vgs = vgsLimited;
          vgd = vgdLimited;
        }
      }
      s.vgs = vgs;
      s.vgd = vgd;
      caps = null;
      junctionCurrent(vgs, k.isat, k.vtGate, j);
      s.cgsDiode = j.i + ctx.gmin * vgs;
      s.ggs = j.g + ctx.gmin;
      junctionCurrent(vgd, k.isat, k.vtGate, j);
      s.cgdDiode = j.i + ctx.gmin * vgd;
      s.ggd = j.g + ctx.gmin;
      channel(k, vgs, vgd, s);
      const vds = vgs - vgd;
      if (k.gd > 0) stamp.conductance(d, dp, k.gd);
      if (k.gs > 0) stamp.conductance(src, sp, k.gs);
      stamp.conductance(g, sp, s.ggs);
      stamp.current(g, sp, t * (s.cgsDiode - s.ggs * vgs));
      stamp.conductance(g, dp, s.ggd);
      stamp.current(g, dp, t * (s.cgdDiode - s.ggd * vgd));
      stamp.transconductance(dp, sp, g, sp, s.gm);
      stamp.transconductance(dp, sp, dp, sp, s.gds);
      stamp.current(dp, sp, t * (s.ids - s.gm * vgs - s.gds * vds));
    },
    converged(x) {
      const dvgs = t * (voltageOf(x, g) - voltageOf(x, sp)) - s.vgs;
      const dvgd = t * (voltageOf(x, g) - voltageOf(x, dp)) - s.vgd;
      const cg = s.cgsDiode + s.cgdDiode;
      const cd = s.ids - s.cgdDiode;
      const cgHat = cg + s.ggs * dvgs + s.ggd * dvgd;
      const cdHat = cd + s.gm * dvgs + s.gds * (dvgs - dvgd) - s.ggd * dvgd;
      return currentSettled(cgHat, cg) && currentSettled(cdHat, cd);
    },
    loadAc(stamp, ctx) {
      const w = ctx.omega;
      if (k.gd > 0) stamp.admittance(d, dp, k.gd, 0);
      if (k.gs > 0) stamp.admittance(src, sp, k.gs, 0);
      const c = capacitances2();
      stamp.admittance(g, sp, s.ggs, w * c.cgs);
      stamp.admittance(g, dp, s.ggd, w * c.cgd);
      stamp.transadmittance(dp, sp, g, sp, s.gm, 0);
      stamp.transadmittance(dp, sp, dp, sp, s.gds, 0);
    },
    report(x) {
      const vd = voltageOf(x, d), vg = voltageOf(x, g), vs = voltageOf(x, src);
      const id = s.ids - s.cgdDiode;
      const ig = s.cgsDiode + s.cgdDiode;
      return {
        kind: "jfet",
        type: t === 1 ? "njfet" : "pjfet",
        region: jfetRegion(k, s.vgs, s.vgd),
        vgs: t * (vg - vs),
        vds: t * (vd - vs),
        id,
        ig,
        power: t * (vd * id + vg * ig - vs * (id + ig)),
        gm: s.gm,
        gds: s.gds,
        cgs: capacitances2().cgs,
        cgd: capacitances2().cgd
      };
    }
  };
}

// src/solve/models/mosfet.ts
var MOSFET_PARAMS = [
  { name: "VTO", default: 0, unit: "V", description: "zero-bias threshold voltage" },
  { name: "KP", default: 2e-5, unit: "A/V\xB2", description: "transconductance parameter" },
  { name: "GAMMA", default: 0, unit: "\u221AV", description: "body-effect coefficient" },
  { name: "PHI", default: 0.6, unit: "V", description: "surface potential" },
  { name: "LAMBDA", default: 0, unit: "1/V", description: "channel-length modulation" },
  { name: "RD", default: 0, unit: "\u03A9", description: "drain ohmic resistance" },
  { name: "RS", default: 0, unit: "\u03A9", description: "source ohmic resistance" },
  { name: "CBD", default: 0, unit: "F", description: "zero-bias bulk-drain junction capacitance" },
  { name: "CBS", default: 0, unit: "F", description: "zero-bias bulk-source junction capacitance" },
  { name: "IS", default: 1e-14, unit: "A", description: "bulk junction saturation current" },
  { name: "PB", default: 0.8, unit: "V", description: "bulk junction potential" },
  { name: "MJ", default: 0.5, unit: "", description: "bulk junction grading coefficient" },
  { name: "FC", default: 0.5, unit: "", description: "forward-bias depletion capacitance coefficient" },
  { name: "CGSO", default: 0, unit: "F/m", description: "gate-source overlap capacitance per metre of W" },
  { name: "CGDO", default: 0, unit: "F/m", description: "gate-drain overlap capacitance per metre of W" },
  { name: "CGBO", default: 0, unit: "F/m", description: "gate-bulk overlap capacitance per metre of L" },
  { name: "TOX", default: NaN, unit: "m", description: "oxide thickness (enables Meyer gate capacitance)" },
  { name: "LD", default: 0, unit: "m", description: "lateral diffusion" }
];
var DEFAULT_CHANNEL_SIZE = 1e-4;
var OXIDE_PERMITTIVITY = 3.9 * 8854214871e-21;
function mosfetConstants(el) {
  const p = resolveParams(el.model, MOSFET_PARAMS);
  const w = el.w ?? DEFAULT_CHANNEL_SIZE;
  const l = el.l ?? DEFAULT_CHANNEL_SIZE;
  const leff = l - 2 * param(p, "LD");
  const rd = param(p, "RD");
  const rs = param(p, "RS");
  const isat = param(p, "IS");
  const tox = param(p, "TOX");
  const polarity = el.model.type === "PMOS" ? -1 : 1;
  return {
    polarity,
    // Polarity-normalised: a PMOS card's VTO = −2 V means it turns on 2 V "forward".
    vto: polarity * param(p, "VTO"),
    beta: param(p, "KP") * w / leff,
    gamma: param(p, "GAMMA"),
    phi: param(p, "PHI"),
    lambda: param(p, "LAMBDA"),
    gd: rd > 0 ? 1 / rd : 0,
    gs: rs > 0 ? 1 / rs : 0,
    isat,
    vcrit: criticalVoltage(isat, THERMAL_VOLTAGE),
    cbd: param(p, "CBD"),
    cbs: param(p, "CBS"),
    pb: param(p, "PB"),
    mj: param(p, "MJ"),
    fc: param(p, "FC"),
    overlapGs: param(p, "CGSO") * w,
    overlapGd: param(p, "CGDO") * w,
    overlapGb: param(p, "CGBO") * leff,
    oxideCap: isGiven(el.model, "TOX") && tox > 0 ? OXIDE_PERMITTIVITY / tox * w * leff : 0
  };
}
function bulkJunction(v, isat, gmin) {
  if (v <= 0) {
    const g = isat / THERMAL_VOLTAGE;
    return [g * v + gmin * v, g + gmin];
  }
  const e = Math.exp(Math.min(v / THERMAL_VOLTAGE, 700));
  return [isat * (e - 1) + gmin * v, isat * e / THERMAL_VOLTAGE + gmin];
}
function drainCurrent(k, s) {
  const normal = s.mode === 1;
  const vbsx = normal ? s.vbs : s.vbs - s.vds;
  const vgsx = normal ? s.vgs : s.vgs - s.vds;
  const vdsx = s.vds * s.mode;
  let sarg;
  if (vbsx <= 0) {
    sarg = Math.sqrt(k.phi - vbsx);
  } else {
    sarg = Math.sqrt(k.phi);
    sarg = Math.max(0, sarg - vbsx / (sarg + sarg));
  }
  const von = k.vto + k.gamma * (sarg - Math.sqrt(k.phi));
  const vgst = vgsx - von;
  s.von = von;
  s.vdsat = Math.max(vgst, 0);
  const arg = sarg <= 0 ? 0 : k.gamma / (sarg + sarg);
  if (vgst <= 0) {
    s.cdrain = 0;
    s.gm = 0;
    s.gds = 0;
    s.gmbs = 0;
    return;
  }
  const betap = k.beta * (1 + k.lambda * vdsx);
  if (vgst <= vdsx) {
    s.cdrain = betap * vgst * vgst * 0.5;
    s.gm = betap * vgst;
    s.gds = k.lambda * k.beta * vgst * vgst * 0.5;
  } else {
    s.cdrain = betap * vdsx * (vgst - 0.5 * vdsx);
    s.gm = betap * vdsx;
    s.gds = betap * (vgst - vdsx) + k.lambda * k.beta * vdsx * (vgst - 0.5 * vdsx);
  }
  s.gmbs = s.gm * arg;
}
function gateCapacitances(k, s) {
  let cgs = 0, cgd = 0, cgb = 0;
  if (k.oxideCap > 0) {
    const cox = k.oxideCap;
    const normal = s.mode === 1;
    const vgsx = normal ? s.vgs : s.vgs - s.vds;
    const vdsx = s.vds * s.mode;
    const vgst = vgsx - s.von;
    const vdsat = Math.max(s.vdsat, 1e-12);
    const phi = k.phi;
    if (vgst <= -phi) {
      cgb = cox / 2;
    } else if (vgst <= -phi / 2) {
      cgb = -vgst * cox / (2 * phi);
    } else if (vgst <= 0) {
      cgb = -vgst * cox / (2 * phi);
      cgs = vgst * cox / (1.5 * phi) + cox / 3;
    } else if (vdsat <= vdsx) {
      cgs = cox / 3;
    } else {
      const vddif = 2 * vdsat - vdsx;
      const vddif1 = vdsat - vdsx;
      const vddif2 = vddif * vddif;
      cgd = cox * (1 - vdsat * vdsat / vddif2) / 3;
      cgs = cox * (1 - vddif1 * vddif1 / vddif2) / 3;
    }
    cgs *= 2;
    cgd *= 2;
    cgb *= 2;
    if (!normal) [cgs, cgd] = [cgd, cgs];
  }
  return { cgs: cgs + k.overlapGs, cgd: cgd + k.overlapGd, cgb: cgb + k.overlapGb };
}
function mosRegion(s) {
  const vgsx = s.mode === 1 ? s.vgs : s.vgs - s.vds;
  const vgst = vgsx - s.von;
  if (vgst <= 0) return "cut-off";
  return vgst <= s.vds * s.mode ? "saturation" : "triode";
}
function mosfetDevice(el, unknowns, memo) {
  const k = memo ? memo.derived(MOSFET_PARAMS, el.model, `${el.w ?? DEFAULT_CHANNEL_SIZE}:${el.l ?? DEFAULT_CHANNEL_SIZE}`, () => mosfetConstants(el)) : mosfetConstants(el);
  const d = unknowns.node(el.d);
  const g = unknowns.node(el.g);
  const src = unknowns.node(el.s);
  const b = unknowns.node(el.b);
  const dp = k.gd > 0 ? unknowns.internalNode(el.name, "drain") : d;
  const sp = k.gs > 0 ? unknowns.internalNode(el.name, "source") : src;
  const t = k.polarity;
  const s = {
    vgs: 0,
    vds: 0,
    vbs: 0,
    mode: 1,
    von: k.vto,
    vdsat: 0,
    cdrain: 0,
    gm: 0,
    gds: 0,
    gmbs: 0,
    cbs: 0,
    gbs: 0,
    cbd: 0,
    gbd: 0
  };
  let caps = null;
  const capacitances2 = () => caps ??= {
    ...gateCapacitances(k, s),
    cbs: depletionCapacitance(s.vbs, k.cbs, k.pb, k.mj, k.fc),
    cbd: depletionCapacitance(s.vbs - s.vds, k.cbd, k.pb, k.mj, k.fc)
  };
  return {
    name: el.name,
    active: true,
    nodes: [d, g, src, b],
    acAffine: true,
    loadDc(x, stamp, ctx) {
      let vgs, vds, vbs;
      if (ctx.mode === "init-junction") {
        vbs = -1;
        vgs = k.vto;
        vds = 0;
      } else {
        vgs = t * (voltageOf(x, g) - voltageOf(x, sp));
        vds = t * (voltageOf(x, dp) - voltageOf(x, sp));
        vbs = t * (voltageOf(x, b) - voltageOf(x, sp));
        if (ctx.mode === "normal") {
          const vgd = vgs - vds;
          const vgdOld = s.vgs - s.vds;
          let changed = false;
          if (s.vds >= 0) {
            const g1 = fetlim(vgs, s.vgs, s.von);
            const d0 = g1 - vgd;
            const d1 = limvds(d0, s.vds);
            if (g1 !== vgs || d1 !== d0) {
              changed = true;
              vgs = g1;
              vds = d1;
            }
          } else {
            const g1 = fetlim(vgd, vgdOld, s.von);
            const d0 = -(vgs - g1);
            const d1 = limvds(d0, -s.vds);
            if (g1 !== vgd || d1 !== d0) {
              changed = true;
              vds = -d1;
              vgs = g1 + vds;
            }
          }
          if (changed) ctx.limited = true;
          if (vds >= 0) {
            vbs = pnjlim(vbs, s.vbs, THERMAL_VOLTAGE, k.vcrit, ctx);
          } else {
            const vbd2 = vbs - vds;
            const limited = pnjlim(vbd2, s.vbs - s.vds, THERMAL_VOLTAGE, k.vcrit, ctx);
            if (limited !== vbd2) vbs = limited + vds;
          }
        }
      }
      s.vgs = vgs;
      s.vds = vds;
      s.vbs = vbs;
      s.mode = vds >= 0 ? 1 : -1;
      caps = null;
      const vbd = vbs - vds;
      [s.cbs, s.gbs] = bulkJunction(vbs, k.isat, ctx.gmin);
      [s.cbd, s.gbd] = bulkJunction(vbd, k.isat, ctx.gmin);
      drainCurrent(k, s);
      if (k.gd > 0) stamp.conductance(d, dp, k.gd);
      if (k.gs > 0) stamp.conductance(src, sp, k.gs);
      stamp.conductance(b, sp, s.gbs);
      stamp.current(b, sp, t * (s.cbs - s.gbs * vbs));
      stamp.conductance(b, dp, s.gbd);
      stamp.current(b, dp, t * (s.cbd - s.gbd * vbd));
      if (s.mode === 1) {
        stamp.transconductance(dp, sp, g, sp, s.gm);
        stamp.transconductance(dp, sp, dp, sp, s.gds);
        stamp.transconductance(dp, sp, b, sp, s.gmbs);
        stamp.current(dp, sp, t * (s.cdrain - s.gm * vgs - s.gds * vds - s.gmbs * vbs));
      } else {
        const vgd = vgs - vds;
        stamp.transconductance(sp, dp, g, dp, s.gm);
        stamp.transconductance(sp, dp, sp, dp, s.gds);
        stamp.transconductance(sp, dp, b, dp, s.gmbs);
        stamp.current(sp, dp, t * (s.cdrain - s.gm * vgd - s.gds * -vds - s.gmbs * vbd));
      }
    },
    converged(x) {
      const vgs = t * (voltageOf(x, g) - voltageOf(x, sp));
      const vds = t * (voltageOf(x, dp) - voltageOf(x, sp));
      const vbs = t * (voltageOf(x, b) - voltageOf(x, sp));
      const dvgs = vgs - s.vgs, dvds = vds - s.vds, dvbs = vbs - s.vbs;
      const dvbd = dvbs - dvds, dvgd = dvgs - dvds;
      const cd = s.mode * s.cdrain - s.cbd;
      const cdHat = s.mode === 1 ? cd - s.gbd * dvbd + s.gmbs * dvbs + s.gm * dvgs + s.gds * dvds : cd - (s.gbd - s.gmbs) * dvbd - s.gm * dvgd + s.gds * dvds;
      const cb = s.cbs + s.cbd;
      const cbHat = cb + s.gbd * dvbd + s.gbs * dvbs;
      return currentSettled(cdHat, cd) && currentSettled(cbHat, cb);
    },
    loadAc(stamp, ctx) {
      const w = ctx.omega;
      const c = capacitances2();
      if (k.gd > 0) stamp.admittance(d, dp, k.gd, 0);
      if (k.gs > 0) stamp.admittance(src, sp, k.gs, 0);
      stamp.admittance(b, sp, s.gbs, w * c.cbs);
      stamp.admittance(b, dp, s.gbd, w * c.cbd);
      stamp.admittance(g, sp, 0, w * c.cgs);
      stamp.admittance(g, dp, 0, w * c.cgd);
      stamp.admittance(g, b, 0, w * c.cgb);
      if (s.mode === 1) {
        stamp.transadmittance(dp, sp, g, sp, s.gm, 0);
        stamp.transadmittance(dp, sp, dp, sp, s.gds, 0);
        stamp.transadmittance(dp, sp, b, sp, s.gmbs, 0);
      } else {
        stamp.transadmittance(sp, dp, g, dp, s.gm, 0);
        stamp.transadmittance(sp, dp, sp, dp, s.gds, 0);
        stamp.transadmittance(sp, dp, b, dp, s.gmbs, 0);
      }
    },
    report(x) {
      const vd = voltageOf(x, d), vg = voltageOf(x, g), vs = voltageOf(x, src), vb = voltageOf(x, b);
      const id = s.mode * s.cdrain - s.cbd;
      const ib = s.cbs + s.cbd;
      const c = capacitances2();
      return {
        kind: "mosfet",
        type: t === 1 ? "nmos" : "pmos",
        region: mosRegion(s),
        vgs: t * (vg - vs),
        vds: t * (vd - vs),
        vbs: t * (vb - vs),
        id,
        vth: s.von,
        power: t * (vd * id + vb * ib - vs * (id + ib)),
        gm: s.gm,
        gds: s.gds,
        gmbs: s.gmbs,
        cgs: c.cgs,
        cgd: c.cgd,
        cgb: c.cgb
      };
    }
  };
}

// src/solve/models/passive.ts
var MIN_RESISTANCE = 1e-3;
var MIN_BRANCH_IMPEDANCE = 1e-9;
var Resistor = class {
  constructor(name, a, b, ohms) {
    this.name = name;
    this.a = a;
    this.b = b;
    const r = Math.abs(ohms) < MIN_RESISTANCE ? Math.sign(ohms || 1) * MIN_RESISTANCE : ohms;
    this.g = 1 / r;
  }
  name;
  a;
  b;
  active = false;
  dcConstant = true;
  acAffine = true;
  g;
  get nodes() {
    return [this.a, this.b];
  }
  loadDc(_x, stamp) {
    stamp.conductance(this.a, this.b, this.g);
  }
  loadAc(stamp) {
    stamp.admittance(this.a, this.b, this.g, 0);
  }
};
function resistorDevice(el, unknowns) {
  const a = unknowns.node(el.a);
  return new Resistor(el.name, a, unknowns.node(el.b), el.ohms);
}
function seriesRlcAdmittance(omega, farads, esr, esl, out) {
  if (omega <= 0 || farads <= 0) {
    out[0] = 0;
    out[1] = 0;
    return out;
  }
  const zr = esr;
  let zi = omega * esl - 1 / (omega * farads);
  let mag2 = zr * zr + zi * zi;
  if (mag2 < MIN_BRANCH_IMPEDANCE * MIN_BRANCH_IMPEDANCE) {
    zi = MIN_BRANCH_IMPEDANCE;
    mag2 = zr * zr + zi * zi;
  }
  out[0] = zr / mag2;
  out[1] = -zi / mag2;
  return out;
}
var ADMITTANCE = [0, 0];
var Capacitor = class {
  constructor(name, a, b, farads, esr, esl) {
    this.name = name;
    this.a = a;
    this.b = b;
    this.farads = farads;
    this.esr = esr;
    this.esl = esl;
    this.acAffine = esr === 0 && esl === 0;
  }
  name;
  a;
  b;
  farads;
  esr;
  esl;
  active = false;
  dcConstant = true;
  /** A pure capacitance is jωC; with ESR or ESL the series branch is not affine in ω. */
  acAffine;
  get nodes() {
    return [this.a, this.b];
  }
  /** Open at DC: nothing to stamp. */
  loadDc() {
  }
  loadAc(stamp, ctx) {
    const y = seriesRlcAdmittance(ctx.omega, this.farads, this.esr, this.esl, ADMITTANCE);
    stamp.admittance(this.a, this.b, y[0], y[1]);
  }
};
function capacitorDevice(el, unknowns) {
  const a = unknowns.node(el.a);
  return new Capacitor(el.name, a, unknowns.node(el.b), el.farads, el.esr ?? 0, el.esl ?? 0);
}
function inductorDevice(el, unknowns) {
  const a = unknowns.node(el.a);
  const b = unknowns.node(el.b);
  const branch = unknowns.branch(el.name);
  const r = el.series ?? 0;
  return {
    name: el.name,
    active: false,
    nodes: [a, b],
    branch,
    dcConstant: true,
    acAffine: true,
    loadDc(_x, stamp) {
      stamp.entry(a, branch, 1);
      stamp.entry(b, branch, -1);
      stamp.entry(branch, a, 1);
      stamp.entry(branch, b, -1);
      stamp.entry(branch, branch, -r);
    },
    loadAc(stamp, ctx) {
      stamp.entry(a, branch, 1, 0);
      stamp.entry(b, branch, -1, 0);
      stamp.entry(branch, a, 1, 0);
      stamp.entry(branch, b, -1, 0);
      stamp.entry(branch, branch, -r, -ctx.omega * el.henries);
    }
  };
}
function voltageSourceDevice(el, unknowns) {
  const pos = unknowns.node(el.pos);
  const neg = unknowns.node(el.neg);
  const branch = unknowns.branch(el.name);
  const rs = el.series ?? 0;
  return {
    name: el.name,
    active: false,
    nodes: [pos, neg],
    branch,
    acAffine: true,
    loadDc(_x, stamp, ctx) {
      stamp.entry(pos, branch, 1);
      stamp.entry(neg, branch, -1);
      stamp.entry(branch, pos, 1);
      stamp.entry(branch, neg, -1);
      stamp.entry(branch, branch, -rs);
      stamp.rhs(branch, el.dc * ctx.srcFactor);
    },
    loadAc(stamp, ctx) {
      stamp.entry(pos, branch, 1, 0);
      stamp.entry(neg, branch, -1, 0);
      stamp.entry(branch, pos, 1, 0);
      stamp.entry(branch, neg, -1, 0);
      stamp.entry(branch, branch, -rs, 0);
      if (ctx.excitedSource === el.name) stamp.rhs(branch, 1, 0);
    },
    delivered(x) {
      return -voltageOf(x, branch);
    }
  };
}
function currentSourceDevice(el, unknowns) {
  const pos = unknowns.node(el.pos);
  const neg = unknowns.node(el.neg);
  return {
    name: el.name,
    active: false,
    nodes: [pos, neg],
    acAffine: true,
    loadDc(_x, stamp, ctx) {
      stamp.current(pos, neg, el.dc * ctx.srcFactor);
    },
    loadAc(stamp, ctx) {
      if (ctx.excitedSource === el.name) stamp.current(pos, neg, 1, 0);
    },
    delivered(_x, srcFactor) {
      return el.dc * srcFactor;
    }
  };
}

// src/solve/elaborate.ts
function deviceFor(el, unknowns, memo) {
  switch (el.kind) {
    case "R":
      return resistorDevice(el, unknowns);
    case "C":
      return capacitorDevice(el, unknowns);
    case "L":
      return inductorDevice(el, unknowns);
    case "V":
      return voltageSourceDevice(el, unknowns);
    case "I":
      return currentSourceDevice(el, unknowns);
    case "D":
      return diodeDevice(el, unknowns, memo);
    case "Q":
      return bjtDevice(el, unknowns, memo);
    case "J":
      return jfetDevice(el, unknowns, memo);
    case "M":
      return mosfetDevice(el, unknowns, memo);
  }
}
function forEachNumericField(el, check) {
  switch (el.kind) {
    case "R":
      check("resistance", el.ohms);
      return;
    case "C":
      check("capacitance", el.farads);
      check("ESR", el.esr);
      check("ESL", el.esl);
      return;
    case "L":
      check("inductance", el.henries);
      check("series resistance", el.series);
      return;
    case "V":
      check("voltage", el.dc);
      check("AC amplitude", el.ac);
      check("series resistance", el.series);
      return;
    case "I":
      check("current", el.dc);
      check("AC amplitude", el.ac);
      return;
    case "D":
    case "Q":
    case "J":
      check("area", el.area);
      return;
    case "M":
      check("W", el.w);
      check("L", el.l);
      return;
  }
}
function pinCount(el) {
  switch (el.kind) {
    case "R":
    case "C":
    case "L":
    case "V":
    case "I":
    case "D":
      return 2;
    case "Q":
    case "J":
      return 3;
    case "M":
      return 4;
  }
}
function pinNode(el, i) {
  switch (el.kind) {
    case "R":
    case "C":
    case "L":
      return i === 0 ? el.a : el.b;
    case "V":
    case "I":
      return i === 0 ? el.pos : el.neg;
    case "D":
      return i === 0 ? el.anode : el.cathode;
    case "Q":
      return i === 0 ? el.c : i === 1 ? el.b : el.e;
    case "J":
      return i === 0 ? el.d : i === 1 ? el.g : el.s;
    case "M":
      return i === 0 ? el.d : i === 1 ? el.g : i === 2 ? el.s : el.b;
  }
}
function hasVisibleCharacter(name) {
  for (let i = 0; i < name.length; i++) {
    const c = name.charCodeAt(i);
    const space = c >= 9 && c <= 13 || c === 32 || c === 160 || c === 5760 || c >= 8192 && c <= 8202 || c === 8232 || c === 8233 || c === 8239 || c === 8287 || c === 12288 || c === 65279;
    if (!space) return true;
  }
  return false;
}
function nodeNumbering(circuit) {
  const names = [];
  const index = /* @__PURE__ */ new Map();
  const pinNames = [];
  let touchesGround = false;
  for (const el of circuit.elements) {
    const pins = pinCount(el);
    for (let i = 0; i < pins; i++) pinNames.push(pinNode(el, i));
  }
  const pinNodes = new Int32Array(pinNames.length);
  for (let p = 0; p < pinNames.length; p++) {
    const name = pinNames[p];
    if (name === "0") {
      touchesGround = true;
      pinNodes[p] = -1;
      continue;
    }
    let node = index.get(name);
    if (node === void 0) {
      node = names.length;
      index.set(name, node);
      names.push(name);
    }
    pinNodes[p] = node;
  }
  return { names, index, touchesGround, pinNames, pinNodes };
}
function validateElements(circuit) {
  const problems = [];
  const seen = /* @__PURE__ */ new Set();
  const cardsChecked = /* @__PURE__ */ new Set();
  let current;
  const check = (label, value) => {
    if (value !== void 0 && !Number.isFinite(value)) problems.push(`${current?.name ?? "?"} has a ${label} that is not a finite number (${value})`);
  };
  for (const el of circuit.elements) {
    current = el;
    if (seen.has(el.name)) problems.push(`two elements are both named ${el.name}`);
    seen.add(el.name);
    forEachNumericField(el, check);
    if ((el.kind === "D" || el.kind === "Q" || el.kind === "J" || el.kind === "M") && !cardsChecked.has(el.model)) {
      cardsChecked.add(el.model);
      for (const name in el.model.params) {
        if (Number.isNaN(el.model.params[name])) problems.push(`${el.name}: model ${el.model.name} parameter ${name} is not a number`);
      }
    }
    const pins = pinCount(el);
    for (let i = 0; i < pins; i++) {
      if (!hasVisibleCharacter(pinNode(el, i))) problems.push(`${el.name} has a pin that is not connected to any node`);
    }
    if (el.kind === "M" && (el.w !== void 0 && el.w <= 0 || el.l !== void 0 && el.l <= 0)) {
      problems.push(`${el.name} needs a positive channel W and L`);
    }
  }
  return problems;
}
var finiteOrAbsent = (v) => v === void 0 || Number.isFinite(v);
function valuesUsable(circuit) {
  let lastCard;
  for (const el of circuit.elements) {
    switch (el.kind) {
      case "R":
        if (!Number.isFinite(el.ohms)) return false;
        continue;
      case "C":
        if (!Number.isFinite(el.farads) || !finiteOrAbsent(el.esr) || !finiteOrAbsent(el.esl)) return false;
        continue;
      case "L":
        if (!Number.isFinite(el.henries) || !finiteOrAbsent(el.series)) return false;
        continue;
      case "V":
        if (!Number.isFinite(el.dc) || !finiteOrAbsent(el.ac) || !finiteOrAbsent(el.series)) return false;
        continue;
      case "I":
        if (!Number.isFinite(el.dc) || !finiteOrAbsent(el.ac)) return false;
        continue;
      case "D":
      case "Q":
      case "J":
        if (!finiteOrAbsent(el.area)) return false;
        break;
      case "M":
        if (!finiteOrAbsent(el.w) || !finiteOrAbsent(el.l)) return false;
        if (el.w !== void 0 && el.w <= 0 || el.l !== void 0 && el.l <= 0) return false;
        break;
    }
    if (el.model === lastCard) continue;
    lastCard = el.model;
    for (const name in el.model.params) if (Number.isNaN(el.model.params[name])) return false;
  }
  return true;
}
function elaborate(circuit, numbering = nodeNumbering(circuit)) {
  const unknowns = new UnknownMap(numbering);
  const elements = circuit.elements;
  const devices = new Array(elements.length);
  const memo = new ElaborationMemo();
  for (let i = 0; i < elements.length; i++) devices[i] = deviceFor(elements[i], unknowns, memo);
  return { circuit, unknowns, devices };
}

// src/solve/diagnose.ts
var DisjointSets = class {
  parent = /* @__PURE__ */ new Map();
  find(x) {
    let root = x;
    for (; ; ) {
      const up = this.parent.get(root);
      if (up === void 0) {
        this.parent.set(root, root);
        break;
      }
      if (up === root) break;
      root = up;
    }
    for (let node = x; node !== root; ) {
      const next = this.parent.get(node) ?? root;
      this.parent.set(node, root);
      node = next;
    }
    return root;
  }
  union(a, b) {
    const ra = this.find(a), rb = this.find(b);
    if (ra === rb) return false;
    this.parent.set(ra, rb);
    return true;
  }
};
function list(names) {
  if (names.length <= 1) return names.join("");
  return `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`;
}
function plural(word, count) {
  return count === 1 ? word : `${word}s`;
}
function describeBlockers(group, elements) {
  const caps = [], currents = [], gates = [];
  for (const el of elements) {
    if (el.kind === "C" && (group.has(el.a) || group.has(el.b))) caps.push(el.name);
    else if (el.kind === "I" && (group.has(el.pos) || group.has(el.neg))) currents.push(el.name);
    else if (el.kind === "M" && group.has(el.g) && !group.has(el.d)) gates.push(el.name);
  }
  const parts = [];
  if (caps.length) parts.push(`${plural("capacitor", caps.length)} ${caps.join(", ")}`);
  if (currents.length) parts.push(`${plural("current source", currents.length)} ${currents.join(", ")}`);
  if (gates.length) parts.push(`the insulated ${plural("gate", gates.length)} of ${gates.join(", ")}`);
  return { phrase: list(parts), names: [...caps, ...currents, ...gates] };
}
function unionFind(size) {
  const parent = new Int32Array(size + 1);
  for (let i = 0; i <= size; i++) parent[i] = i;
  const find = (x) => {
    let root = x;
    while (parent[root] !== root) root = parent[root];
    for (let node = x; node !== root; ) {
      const next = parent[node];
      parent[node] = root;
      node = next;
    }
    return root;
  };
  return { find, union: (a, b) => {
    const ra = find(a), rb = find(b);
    if (ra !== rb) parent[ra] = rb;
  } };
}
function floatingNodeProblems(circuit, numbering) {
  const { names, index } = numbering;
  const ground = names.length;
  const id = (name) => name === "0" ? ground : index.get(name);
  const sets = unionFind(names.length);
  for (const el of circuit.elements) {
    switch (el.kind) {
      case "R":
      case "L":
        sets.union(id(el.a), id(el.b));
        break;
      case "V":
        sets.union(id(el.pos), id(el.neg));
        break;
      case "C":
      case "I":
        break;
      case "D":
        sets.union(id(el.anode), id(el.cathode));
        break;
      case "Q":
        sets.union(id(el.b), id(el.e));
        sets.union(id(el.b), id(el.c));
        break;
      case "J":
        sets.union(id(el.g), id(el.s));
        sets.union(id(el.g), id(el.d));
        sets.union(id(el.d), id(el.s));
        break;
      case "M":
        sets.union(id(el.d), id(el.s));
        sets.union(id(el.d), id(el.b));
        sets.union(id(el.s), id(el.b));
        break;
    }
  }
  const groundRoot = sets.find(ground);
  let groups = null;
  for (let i = 0; i < names.length; i++) {
    const root = sets.find(i);
    if (root === groundRoot) continue;
    groups ??= /* @__PURE__ */ new Map();
    let group = groups.get(root);
    if (!group) groups.set(root, group = /* @__PURE__ */ new Set());
    group.add(names[i]);
  }
  if (!groups) return [];
  const problems = [];
  for (const group of groups.values()) {
    const nodes = [...group].sort();
    const { phrase, names: blockers } = describeBlockers(group, circuit.elements);
    const subject = nodes.length === 1 ? `node ${nodes[0]} has` : `nodes ${nodes.join(", ")} have`;
    let why;
    if (!phrase) why = nodes.length === 1 ? "nothing else connects to it" : "nothing connects them to the rest of the circuit";
    else if (nodes.length === 1) why = `only ${phrase} touch it`;
    else why = `they reach the rest of the circuit only through ${phrase}`;
    const fix = "add a resistor to ground or to a bias node so its DC voltage is defined";
    problems.push({
      kind: "no-dc-path",
      nodes,
      elements: blockers,
      message: `${subject} no DC path to ground (${why}); ${fix}`
    });
  }
  return problems;
}
function isIdealVoltageBranch(el) {
  if (el.kind === "V") return !(el.series && el.series > 0);
  if (el.kind === "L") return !(el.series && el.series > 0);
  return false;
}
function describeLoopMember(el) {
  return el.kind === "V" ? `voltage source ${el.name}` : `inductor ${el.name}`;
}
function sourceLoopProblems(circuit) {
  const sets = new DisjointSets();
  const forest = /* @__PURE__ */ new Map();
  const addEdge = (a, b, el) => {
    if (!forest.has(a)) forest.set(a, []);
    if (!forest.has(b)) forest.set(b, []);
    forest.get(a)?.push({ to: b, el });
    forest.get(b)?.push({ to: a, el });
  };
  const pathBetween = (from, to) => {
    const back = /* @__PURE__ */ new Map();
    const queue = [from];
    const visited = /* @__PURE__ */ new Set([from]);
    while (queue.length) {
      const node = queue.shift();
      if (node === to) break;
      for (const edge of forest.get(node) ?? []) {
        if (visited.has(edge.to)) continue;
        visited.add(edge.to);
        back.set(edge.to, { prev: node, el: edge.el });
        queue.push(edge.to);
      }
    }
    const path = [];
    for (let node = to; node !== from; ) {
      const step = back.get(node);
      if (!step) break;
      path.push(step.el);
      node = step.prev;
    }
    return path;
  };
  const problems = [];
  for (const el of circuit.elements) {
    if (!isIdealVoltageBranch(el)) continue;
    const [a, b] = el.kind === "V" ? [el.pos, el.neg] : [el.a, el.b];
    if (a === b) {
      problems.push({
        kind: "source-loop",
        nodes: [a],
        elements: [el.name],
        message: `${describeLoopMember(el)} has both ends on node ${a}; at DC its current is undefined (remove it or connect its other end)`
      });
      continue;
    }
    if (sets.union(a, b)) {
      addEdge(a, b, el);
      continue;
    }
    const loop = [el, ...pathBetween(a, b)];
    const loopNodes = /* @__PURE__ */ new Set();
    for (const member of loop) {
      for (const n of member.kind === "V" ? [member.pos, member.neg] : member.kind === "L" ? [member.a, member.b] : []) loopNodes.add(n);
    }
    const onlySources = loop.every((m) => m.kind === "V");
    const advice = onlySources ? "two ideal sources cannot both set the same voltage; remove one or give it a series resistance" : "at DC this loop has no defined current; give the inductor its winding resistance or break the loop";
    problems.push({
      kind: "source-loop",
      nodes: [...loopNodes].sort(),
      elements: loop.map((m) => m.name),
      message: `${list(loop.map(describeLoopMember))} form a loop with no resistance (nodes ${[...loopNodes].sort().join(", ")}); ${advice}`
    });
  }
  return problems;
}
function diagnoseTopology(circuit, numbering) {
  const invalid = validateElements(circuit).map((message) => ({
    kind: "invalid-value",
    nodes: [],
    elements: [],
    message
  }));
  if (invalid.length) return invalid;
  if (circuit.elements.length === 0) {
    return [{ kind: "no-dc-path", nodes: [], elements: [], message: "the circuit has no elements" }];
  }
  const nodes = numbering ?? nodeNumbering(circuit);
  if (!nodes.touchesGround) {
    return [{ kind: "no-dc-path", nodes: [], elements: [], message: "no element connects to ground (node 0); every voltage is undefined" }];
  }
  const loops = sourceLoopProblems(circuit);
  const floating = floatingNodeProblems(circuit, nodes);
  return loops.length === 0 ? floating : floating.length === 0 ? loops : [...loops, ...floating];
}

// src/solve/prepared.ts
var PREPARED = /* @__PURE__ */ Symbol("loadline prepared circuit");
function stillSame(entry, elements) {
  const known = entry.elements, names = entry.names, pins = entry.prepared.numbering.pinNames;
  if (known.length !== elements.length) return false;
  let k = 0;
  for (let i = 0; i < elements.length; i++) {
    const el = elements[i];
    if (el !== known[i] || el.name !== names[i]) return false;
    switch (el.kind) {
      case "R":
      case "C":
      case "L":
        if (el.a !== pins[k] || el.b !== pins[k + 1]) return false;
        k += 2;
        break;
      case "V":
      case "I":
        if (el.pos !== pins[k] || el.neg !== pins[k + 1]) return false;
        k += 2;
        break;
      case "D":
        if (el.anode !== pins[k] || el.cathode !== pins[k + 1]) return false;
        k += 2;
        break;
      case "Q":
        if (el.c !== pins[k] || el.b !== pins[k + 1] || el.e !== pins[k + 2]) return false;
        k += 3;
        break;
      case "J":
        if (el.d !== pins[k] || el.g !== pins[k + 1] || el.s !== pins[k + 2]) return false;
        k += 3;
        break;
      case "M":
        if (el.d !== pins[k] || el.g !== pins[k + 1] || el.s !== pins[k + 2] || el.b !== pins[k + 3]) return false;
        k += 4;
        break;
    }
  }
  return true;
}
function preparedCircuit(circuit) {
  const holder = circuit;
  const entry = holder[PREPARED];
  if (entry && stillSame(entry, circuit.elements)) {
    if (entry.prepared.problems.length === 0 && valuesUsable(circuit)) return entry.prepared;
    return { numbering: entry.prepared.numbering, problems: diagnoseTopology(circuit, entry.prepared.numbering), dcPattern: null, dcFactors: null };
  }
  const numbering = nodeNumbering(circuit);
  const prepared = { numbering, problems: diagnoseTopology(circuit, numbering), dcPattern: null, dcFactors: null };
  if (Object.isExtensible(circuit)) {
    const fresh = { prepared, elements: circuit.elements.slice(), names: circuit.elements.map((el) => el.name) };
    if (entry) holder[PREPARED] = fresh;
    else Object.defineProperty(circuit, PREPARED, { value: fresh, writable: true });
  }
  return prepared;
}

// src/solve/dc.ts
var { reltol: RELTOL, vntol: VNTOL, abstol: ABSTOL } = TOLERANCES;
var PLAIN_NEWTON_LIMIT = 100;
var STEP_NEWTON_LIMIT = 60;
var MAX_CONTINUATION_STEPS = 200;
var DEFAULT_MAX_ITERATIONS = 3e3;
var DEFAULT_MAX_MILLIS = 1e4;
var DEFAULT_GMIN = 1e-12;
var DcSolver = class {
  constructor(elaborated, gmin, maxIterations, deadline, pattern, factors) {
    this.elaborated = elaborated;
    this.gmin = gmin;
    this.maxIterations = maxIterations;
    this.deadline = deadline;
    this.ctx = { mode: "normal", gmin, srcFactor: 1, limited: false };
    this.varying = elaborated.devices.filter((d) => !d.dcConstant);
    this.attach(new RealSystem(elaborated.unknowns.size, pattern ?? void 0, 3 * elaborated.unknowns.size, factors));
  }
  elaborated;
  gmin;
  maxIterations;
  deadline;
  system;
  stamp;
  x;
  xNew;
  totalIterations = 0;
  ctx;
  baseReady = false;
  varying;
  /** Absolute part of each unknown's convergence tolerance: ABSTOL for currents, VNTOL for voltages. */
  absTol;
  /** Unknowns that are node voltages, where gmin stepping puts its shunts. */
  voltageUnknowns;
  /** Last device whose junction step was limited in the latest load, for the explanation. */
  lastLimiting;
  /** The pattern snapshot given did not fit the circuit, so the solve went on without it. */
  leftSnapshot = false;
  /** Takes `system` as the matrix, with the iterate and per-unknown vectors from its arena. */
  attach(system) {
    const { unknowns } = this.elaborated;
    const n = unknowns.size;
    const arena = system.arena;
    const x = arena.f64(n);
    if (this.x) x.set(this.x);
    this.system = system;
    this.stamp = new RealStamper(system);
    this.x = x;
    this.xNew = arena.f64(n);
    this.absTol = arena.f64(n);
    let voltages = 0;
    for (let i = 0; i < n; i++) {
      const branch = unknowns.isBranch(i);
      this.absTol[i] = branch ? ABSTOL : VNTOL;
      if (!branch) voltages++;
    }
    this.voltageUnknowns = arena.i32(voltages);
    for (let i = 0, v = 0; i < n; i++) if (!unknowns.isBranch(i)) this.voltageUnknowns[v++] = i;
  }
  load(x, mode, srcFactor, diagGmin) {
    const ctx = this.ctx;
    ctx.mode = mode;
    ctx.srcFactor = srcFactor;
    ctx.limited = false;
    if (!this.baseReady) {
      this.system.begin();
      for (const device of this.elaborated.devices) if (device.dcConstant) device.loadDc(x, this.stamp, ctx);
      this.system.saveBase();
      this.baseReady = true;
    }
    this.system.beginFromBase();
    this.lastLimiting = void 0;
    for (const device of this.varying) {
      const before = ctx.limited;
      ctx.limited = false;
      device.loadDc(x, this.stamp, ctx);
      if (ctx.limited) this.lastLimiting = device.name;
      ctx.limited ||= before;
    }
    if (diagGmin > 0) {
      const voltages = this.voltageUnknowns;
      for (let v = 0; v < voltages.length; v++) {
        const i = voltages[v];
        this.system.add(i, i, diagGmin);
      }
    }
    if (this.system.offSnapshot) {
      const stale = this.system;
      this.leftSnapshot = true;
      this.attach(new RealSystem(this.elaborated.unknowns.size, void 0, 3 * this.elaborated.unknowns.size));
      stale.release();
      this.baseReady = false;
      this.load(this.x, mode, srcFactor, diagGmin);
    }
  }
  newton(run) {
    const absTol = this.absTol;
    const n = absTol.length;
    for (let iter = 0; iter < run.limit; iter++) {
      if (this.totalIterations >= this.maxIterations) return { ok: false, iterations: iter, reason: "iteration-cap" };
      if ((this.totalIterations & 7) === 0 && Date.now() >= this.deadline) return { ok: false, iterations: iter, reason: "deadline" };
      this.totalIterations++;
      this.load(this.x, iter === 0 ? run.firstMode : "normal", run.srcFactor, run.diagGmin);
      const limited = this.ctx.limited;
      const solved = this.system.solve(this.xNew);
      if (!solved.ok) return { ok: false, iterations: iter + 1, reason: "singular", unknown: solved.singularUnknown };
      let worstUnknown = -1, worstRatio = 0, worstStep = 0, finite = true;
      const xNew = this.xNew, x = this.x;
      for (let i = 0; i < n; i++) {
        const xn = xNew[i], xo = x[i];
        if (!Number.isFinite(xn)) {
          finite = false;
          break;
        }
        const tol = RELTOL * Math.max(Math.abs(xn), Math.abs(xo)) + absTol[i];
        const ratio = Math.abs(xn - xo) / tol;
        if (ratio > worstRatio) {
          worstRatio = ratio;
          worstUnknown = i;
          worstStep = xn - xo;
        }
      }
      if (!finite) return { ok: false, iterations: iter + 1, reason: "not-finite" };
      [this.x, this.xNew] = [this.xNew, this.x];
      const first = iter === 0 && run.firstMode === "init-junction";
      const unsettled = !first && !limited && worstRatio <= 1 ? this.unsettledDevice() : "not checked";
      if (!first && !limited && worstRatio <= 1 && unsettled === void 0) return { ok: true, iterations: iter + 1 };
      if (iter === run.limit - 1) {
        const failure2 = { ok: false, iterations: iter + 1, reason: "iterations", worstUnknown, worstStep };
        if (limited && this.lastLimiting !== void 0) failure2.stillLimiting = this.lastLimiting;
        if (unsettled !== void 0 && unsettled !== "not checked") failure2.unsettled = unsettled;
        return failure2;
      }
    }
    return { ok: false, iterations: run.limit, reason: "iterations", worstUnknown: -1, worstStep: 0 };
  }
  /** Name of the first device whose currents are still moving beyond tolerance, if any. */
  unsettledDevice() {
    for (const device of this.elaborated.devices) if (device.converged && !device.converged(this.x)) return device.name;
    return void 0;
  }
  /** Evaluates every device exactly at the accepted solution so reports match the node voltages. */
  finalEvaluation(srcFactor) {
    this.load(this.x, "no-limit", srcFactor, 0);
  }
  get remaining() {
    return Math.max(0, this.maxIterations - this.totalIterations);
  }
};
function isHardStop(f) {
  return f !== void 0 && (f.reason === "iteration-cap" || f.reason === "deadline" || f.reason === "singular");
}
function plainNewton(solver) {
  solver.x.fill(0);
  const r = solver.newton({ diagGmin: 0, srcFactor: 1, limit: PLAIN_NEWTON_LIMIT, firstMode: "init-junction" });
  return r.ok ? { ok: true } : { ok: false, failure: r };
}
function gminStepping(solver) {
  solver.x.fill(0);
  let diag = 0.01;
  let factor = 10;
  let lastGood = -1;
  let saved = null;
  let failure2;
  for (let step = 0; step < MAX_CONTINUATION_STEPS; step++) {
    const r2 = solver.newton({
      diagGmin: diag,
      srcFactor: 1,
      limit: STEP_NEWTON_LIMIT,
      firstMode: saved ? "no-limit" : "init-junction"
    });
    if (r2.ok) {
      saved = solver.x.slice();
      lastGood = diag;
      if (diag <= solver.gmin) break;
      if (r2.iterations <= STEP_NEWTON_LIMIT / 4) factor = Math.min(factor * Math.sqrt(factor), 10);
      diag = Math.max(diag / factor, solver.gmin);
      continue;
    }
    failure2 = r2;
    if (!saved || isHardStop(r2)) {
      return { ok: false, failure: r2, progress: saved ? `stalled at a node shunt of ${lastGood.toExponential(1)} S` : "failed even with 10 mS on every node" };
    }
    factor = Math.sqrt(Math.sqrt(factor));
    if (factor < 1.00005) return { ok: false, failure: r2, progress: `stalled at a node shunt of ${lastGood.toExponential(1)} S` };
    solver.x.set(saved);
    diag = lastGood / factor;
  }
  if (!saved || lastGood > solver.gmin) return { ok: false, failure: failure2, progress: `stopped at a node shunt of ${lastGood.toExponential(1)} S` };
  const r = solver.newton({ diagGmin: 0, srcFactor: 1, limit: STEP_NEWTON_LIMIT, firstMode: "no-limit" });
  return r.ok ? { ok: true } : { ok: false, failure: r, progress: "converged with shunts but not after removing the last one" };
}
function sourceStepping(solver) {
  solver.x.fill(0);
  const start = solver.newton({ diagGmin: 0, srcFactor: 0, limit: STEP_NEWTON_LIMIT, firstMode: "init-junction" });
  if (!start.ok) return { ok: false, failure: start, progress: "failed with every source at zero" };
  let reached = 0;
  let raise = 1e-3;
  let saved = solver.x.slice();
  for (let step = 0; step < MAX_CONTINUATION_STEPS * 5; step++) {
    const target = Math.min(1, reached + raise);
    const r = solver.newton({ diagGmin: 0, srcFactor: target, limit: STEP_NEWTON_LIMIT, firstMode: "no-limit" });
    if (r.ok) {
      reached = target;
      saved = solver.x.slice();
      if (reached >= 1) return { ok: true };
      if (r.iterations <= STEP_NEWTON_LIMIT / 4) raise *= 1.5;
      continue;
    }
    if (isHardStop(r)) return { ok: false, failure: r, progress: `reached ${(reached * 100).toFixed(1)} % of the supplies` };
    raise /= 10;
    solver.x.set(saved);
    if (raise < 1e-7) return { ok: false, failure: r, progress: `reached ${(reached * 100).toFixed(1)} % of the supplies` };
  }
  return { ok: false, progress: `reached ${(reached * 100).toFixed(1)} % of the supplies` };
}
function describeFailure(solver, failure2) {
  const unknowns = solver.elaborated.unknowns;
  if (!failure2) return "";
  switch (failure2.reason) {
    case "iteration-cap":
      return `stopped at the cap of ${solver.maxIterations} Newton iterations`;
    case "deadline":
      return "stopped at the time limit";
    case "not-finite":
      return "the iterate overflowed (a device was driven to an absurd voltage)";
    case "singular":
      return `the matrix became singular at ${unknowns.describe(failure2.unknown)}`;
    case "iterations": {
      const where4 = [];
      if (failure2.stillLimiting) where4.push(`${failure2.stillLimiting}'s junction steps were still being limited`);
      if (failure2.unsettled) where4.push(`${failure2.unsettled}'s currents were still changing`);
      if (failure2.worstUnknown >= 0) {
        where4.push(`the largest change was ${formatStep(failure2.worstStep, unknowns.info[failure2.worstUnknown]?.kind === "branch")} at ${unknowns.describe(failure2.worstUnknown)}`);
      }
      return where4.length ? `Newton's method did not settle (${where4.join("; ")})` : "Newton's method did not settle";
    }
  }
}
function formatStep(value, isCurrent) {
  const unit = isCurrent ? "A" : "V";
  return `${value.toPrecision(3)} ${unit}`;
}
function singularMessage(solver, unknown) {
  const info = solver.elaborated.unknowns.info[unknown];
  if (info?.kind === "branch") {
    return `the current through ${info.name} is not fixed by the circuit (the matrix is singular there); check for a loop of voltage sources or inductors, or a source with nothing across it`;
  }
  const where4 = info?.kind === "internal-node" ? `internal node ${info.name}` : `node ${info?.name ?? unknown}`;
  return `the DC voltage of ${where4} is not fixed by the circuit (the matrix is singular there); give it a DC path to ground`;
}
var SOLVED_STATE = /* @__PURE__ */ Symbol("loadline solved state");
function solvedStateOf(op) {
  return op[SOLVED_STATE];
}
function emptyResult(problem2) {
  return {
    converged: false,
    method: "newton",
    iterations: 0,
    nodeVoltages: {},
    branchCurrents: {},
    deliveredCurrents: {},
    devices: {},
    problem: problem2
  };
}
function collectResult(solver, converged, method, problem2) {
  const { unknowns, devices } = solver.elaborated;
  const x = solver.x;
  for (let i = 0; i < x.length; i++) {
    if (!Number.isFinite(x[i])) {
      x.fill(0);
      break;
    }
  }
  solver.finalEvaluation(1);
  const nodeVoltages = {};
  for (let i = 0; i < unknowns.nodeCount; i++) nodeVoltages[unknowns.nodeName(i)] = x[i];
  const branchCurrents = {};
  const deliveredCurrents = {};
  const deviceReports = {};
  for (const device of devices) {
    if (device.branch !== void 0) branchCurrents[device.name] = x[device.branch];
    if (device.delivered) deliveredCurrents[device.name] = device.delivered(x, 1);
    if (device.report) deviceReports[device.name] = device.report(x);
  }
  const result = {
    converged,
    method,
    iterations: solver.totalIterations,
    nodeVoltages,
    branchCurrents,
    deliveredCurrents,
    devices: deviceReports
  };
  if (problem2 !== void 0) result.problem = problem2;
  Object.defineProperty(result, SOLVED_STATE, { value: { elaborated: solver.elaborated, x: x.slice() } });
  return result;
}
function solveOperatingPoint(circuit, opts = {}) {
  const prepared = preparedCircuit(circuit);
  if (prepared.problems.length > 0) return emptyResult(prepared.problems.map((p) => p.message).join("; "));
  const maxIterations = Math.max(1, Math.floor(opts.maxIterations ?? DEFAULT_MAX_ITERATIONS));
  const maxMillis = Math.max(0, opts.maxMillis ?? DEFAULT_MAX_MILLIS);
  const gmin = opts.gmin ?? DEFAULT_GMIN;
  const solver = new DcSolver(elaborate(circuit, prepared.numbering), gmin, maxIterations, Date.now() + maxMillis, prepared.dcPattern, prepared.dcFactors);
  try {
    return solveWith(solver, prepared);
  } finally {
    solver.system.release();
  }
}
function solveWith(solver, prepared) {
  const plain = plainNewton(solver);
  if (!prepared.dcPattern || solver.leftSnapshot) {
    prepared.dcPattern = solver.system.firstPattern;
    prepared.dcFactors = solver.system.firstFactors;
  }
  if (plain.ok) return collectResult(solver, true, "newton");
  if (plain.failure?.reason === "singular") {
    return collectResult(solver, false, "newton", singularMessage(solver, plain.failure.unknown));
  }
  const attempts = [`plain Newton: ${describeFailure(solver, plain.failure)}`];
  if (!isHardStop(plain.failure)) {
    const gminRun = gminStepping(solver);
    if (gminRun.ok) return collectResult(solver, true, "gmin-stepping");
    attempts.push(`gmin stepping: ${gminRun.progress ?? ""}${gminRun.failure ? ` (${describeFailure(solver, gminRun.failure)})` : ""}`);
    if (!isHardStop(gminRun.failure)) {
      const sourceRun = sourceStepping(solver);
      if (sourceRun.ok) return collectResult(solver, true, "source-stepping");
      attempts.push(`source stepping: ${sourceRun.progress ?? ""}${sourceRun.failure ? ` (${describeFailure(solver, sourceRun.failure)})` : ""}`);
    }
  }
  const problem2 = `no DC operating point found after ${solver.totalIterations} iterations \u2014 ${attempts.join("; ")}. Look for a stage without a bias path, positive feedback around a DC loop, or model parameters far outside their usual range.`;
  return collectResult(solver, false, "newton", problem2);
}

// src/solve/ac.ts
var PASSIVE_SHUNT = 1e-12;
function series(length) {
  return { re: new Float64Array(length).fill(NaN), im: new Float64Array(length).fill(NaN) };
}
function failedResult(frequencies, problem2) {
  return { frequencies: [...frequencies], nodeVoltages: {}, branchCurrents: {}, problem: problem2 };
}
function linearisationFor(circuit, op, passiveOnly) {
  if (passiveOnly) return elaborate(circuit, preparedCircuit(circuit).numbering);
  if (!op) return "an AC analysis with active devices needs a DC operating point";
  if (!op.converged) return `no small-signal analysis without a DC operating point: ${op.problem ?? "it did not converge"}`;
  const state = solvedStateOf(op);
  if (state && state.elaborated.circuit === circuit) return state.elaborated;
  const again = solveOperatingPoint(circuit);
  const fresh = solvedStateOf(again);
  if (!again.converged || !fresh) return `no small-signal analysis without a DC operating point: ${again.problem ?? "it did not converge"}`;
  return fresh.elaborated;
}
function acSweep(circuit, op, frequencies, excitation, opts = {}) {
  const passiveOnly = opts.passiveOnly ?? false;
  const bad = frequencies.find((f) => !(Number.isFinite(f) && f > 0));
  if (bad !== void 0) return failedResult(frequencies, `AC frequencies must be positive finite numbers (got ${bad})`);
  const lin = linearisationFor(circuit, op, passiveOnly);
  if (typeof lin === "string") return failedResult(frequencies, lin);
  const { unknowns, devices } = lin;
  let injectAt = GROUND;
  let returnAt = GROUND;
  let excitedSource = null;
  if (excitation.kind === "source") {
    const source = circuit.elements.find((el) => el.name === excitation.name);
    if (!source || source.kind !== "V" && source.kind !== "I") {
      return failedResult(frequencies, `there is no independent source named ${excitation.name} to drive`);
    }
    if (passiveOnly) return failedResult(frequencies, "the passive-only view has its sources removed; drive it with a test current instead");
    excitedSource = excitation.name;
  } else {
    const node = unknowns.lookup(excitation.node);
    if (node === void 0) return failedResult(frequencies, `there is no node named ${excitation.node}`);
    const back = excitation.returnNode === void 0 ? GROUND : unknowns.lookup(excitation.returnNode);
    if (back === void 0) return failedResult(frequencies, `there is no node named ${excitation.returnNode ?? ""}`);
    if (node === back) return failedResult(frequencies, "a test current into and out of the same node measures nothing; choose two different nodes");
    injectAt = node;
    returnAt = back;
  }
  const n = unknowns.size;
  const system = new ComplexSystem(n);
  const stamp = new ComplexStamper(system);
  const xr = new Float64Array(n), xi = new Float64Array(n);
  const ctx = { omega: 0, excitedSource };
  const L = frequencies.length;
  const nodeVoltages = {};
  const branchCurrents = {};
  const outIndex = [];
  for (let i = 0; i < unknowns.nodeCount; i++) outIndex.push(i);
  for (const d of devices) if (d.branch !== void 0) outIndex.push(d.branch);
  const outputs = new Float64Array(2 * L * outIndex.length).fill(NaN);
  const outOf = (o2) => ({ re: outputs.subarray(2 * o2 * L, (2 * o2 + 1) * L), im: outputs.subarray((2 * o2 + 1) * L, (2 * o2 + 2) * L) });
  for (let i = 0; i < unknowns.nodeCount; i++) nodeVoltages[unknowns.nodeName(i)] = outOf(i);
  let o = unknowns.nodeCount;
  for (const d of devices) if (d.branch !== void 0) branchCurrents[d.name] = outOf(o++);
  const outUnknown = Int32Array.from(outIndex);
  const shunted = [];
  if (passiveOnly) {
    for (let i = 0; i < n; i++) if (!unknowns.isBranch(i)) shunted.push(i);
  }
  let problem2;
  const included = devices.filter((d) => !(passiveOnly && d.active));
  const affine = included.filter((d) => d.acAffine === true);
  const perPoint = included.filter((d) => d.acAffine !== true);
  for (const which of [0, 1]) {
    ctx.omega = which;
    system.begin();
    for (const device of affine) device.loadAc(stamp, ctx);
    for (const i of shunted) system.add(i, i, PASSIVE_SHUNT, 0);
    if (excitation.kind === "current") {
      system.addRhs(injectAt, 1, 0);
      system.addRhs(returnAt, -1, 0);
    }
    system.saveAffinePart(which);
  }
  const store = (k, re, im) => {
    for (let o2 = 0, at = k; o2 < outUnknown.length; o2++, at += 2 * L) {
      const index = outUnknown[o2];
      outputs[at] = re[index];
      outputs[at + L] = im[index];
    }
  };
  const single = (k) => {
    const f = frequencies[k];
    ctx.omega = 2 * Math.PI * f;
    system.beginAt(ctx.omega);
    for (const device of perPoint) device.loadAc(stamp, ctx);
    const solved = system.solve(xr, xi);
    if (!solved.ok) {
      problem2 ??= `the small-signal matrix is singular at ${unknowns.describe(solved.singularUnknown)} (${f} Hz)`;
      return;
    }
    store(k, xr, xi);
  };
  const yr = perPoint.length === 0 ? new Float64Array(n) : xr, yi = perPoint.length === 0 ? new Float64Array(n) : xi;
  for (let k = 0; k < L; k++) {
    if (perPoint.length === 0 && k > 0 && k + 1 < L && system.solveAffinePair(2 * Math.PI * frequencies[k], 2 * Math.PI * frequencies[k + 1], xr, xi, yr, yi)) {
      store(k, xr, xi);
      store(k + 1, yr, yi);
      k++;
      continue;
    }
    single(k);
  }
  const result = { frequencies: [...frequencies], nodeVoltages, branchCurrents };
  if (problem2 !== void 0) result.problem = problem2;
  return result;
}
function phaseDeg(re, im) {
  return Math.atan2(im, re) * 180 / Math.PI;
}
function nanSeries(length) {
  return series(length);
}
function impedanceToGround(circuit, op, node, frequencies, opts = {}) {
  const ac = acSweep(circuit, op, frequencies, { kind: "current", node }, opts);
  const v = ac.nodeVoltages[node] ?? nanSeries(frequencies.length);
  return frequencies.map((f, k) => {
    const re = v.re[k], im = v.im[k];
    return { f, mag: Math.hypot(re, im), phaseDeg: phaseDeg(re, im), re, im };
  });
}
function impedanceBetween(circuit, op, a, b, frequencies, opts = {}) {
  if (b === "0") return impedanceToGround(circuit, op, a, frequencies, opts);
  const ac = acSweep(circuit, op, frequencies, { kind: "current", node: a, returnNode: b }, opts);
  const zero = { re: new Float64Array(frequencies.length), im: new Float64Array(frequencies.length) };
  const va = a === "0" ? zero : ac.nodeVoltages[a] ?? nanSeries(frequencies.length);
  const vb = ac.nodeVoltages[b] ?? nanSeries(frequencies.length);
  return frequencies.map((f, k) => {
    const re = va.re[k] - vb.re[k], im = va.im[k] - vb.im[k];
    return { f, mag: Math.hypot(re, im), phaseDeg: phaseDeg(re, im), re, im };
  });
}

// src/circuit/net-voltage.ts
function localNetName(net) {
  const trimmed = net.endsWith("/") ? net.slice(0, -1) : net;
  const slash = trimmed.lastIndexOf("/");
  return slash >= 0 ? trimmed.slice(slash + 1) : trimmed;
}
function voltsFromNetName(net) {
  const name = localNetName(net);
  const match = /(?:^|[^0-9A-Za-z.])([+-]?)(\d+)(?:[.,](\d+))?V(\d+)?(?![0-9])/i.exec(name) ?? /^([+-]?)(\d+)(?:[.,](\d+))?V(\d+)?$/i.exec(name);
  if (!match) return void 0;
  const [, sign, whole, decimals, rkmDecimals] = match;
  if (decimals !== void 0 && rkmDecimals !== void 0) return void 0;
  const fraction = decimals ?? rkmDecimals ?? "";
  const magnitude = Number(`${whole}${fraction ? `.${fraction}` : ""}`);
  if (!Number.isFinite(magnitude)) return void 0;
  return sign === "-" ? -magnitude : magnitude;
}

// src/engine/context-rails.ts
var SOURCE_KINDS2 = /* @__PURE__ */ new Set(["battery", "voltage-source"]);
function sourceVolts(part) {
  const n = part.parsed.number;
  if (n !== void 0 && Number.isFinite(n)) return { volts: n, from: "battery" };
  for (const key of ["Sim.Params", "Sim.Value", "Spice_Model", "Voltage"]) {
    const text = part.fields[key];
    if (text === void 0) continue;
    const dc = /(?:^|\s)dc\s*=?\s*([+-]?\d+(?:\.\d+)?(?:e[+-]?\d+)?)/i.exec(text) ?? /^\s*([+-]?\d+(?:\.\d+)?(?:e[+-]?\d+)?)\s*V?\s*$/i.exec(text);
    if (dc?.[1] !== void 0) return { volts: Number(dc[1]), from: "field" };
  }
  return void 0;
}
function surveyRails(circuit, configured) {
  const groundNets = new Set(circuit.nets.filter((n) => n.isGround).map((n) => n.name));
  const byNet = /* @__PURE__ */ new Map();
  const byAlias = /* @__PURE__ */ new Map();
  for (const [name, volts] of Object.entries(configured)) byAlias.set(name, volts);
  for (const net of circuit.nets) {
    if (net.isGround) continue;
    const configuredVolts = [net.name, localNetName(net.name), ...net.aliases].map((alias) => byAlias.get(alias)).find((v) => v !== void 0);
    if (configuredVolts !== void 0) {
      byNet.set(net.name, { net: net.name, volts: configuredVolts, from: "config" });
      continue;
    }
    if (!net.isPower) continue;
    const named = [net.name, ...net.aliases].map(voltsFromNetName).find((v) => v !== void 0);
    if (named !== void 0) byNet.set(net.name, { net: net.name, volts: named, from: "name" });
  }
  for (const part of circuit.parts) {
    if (!SOURCE_KINDS2.has(part.kind) || part.dnp) continue;
    const plusPin = part.roles["+"];
    const minusPin = part.roles["-"];
    const plus = plusPin !== void 0 ? part.pins[plusPin] : void 0;
    const minus = minusPin !== void 0 ? part.pins[minusPin] : void 0;
    if (plus === void 0 || minus === void 0) continue;
    const value = sourceVolts(part);
    if (value === void 0) continue;
    let net;
    let volts = value.volts;
    if (groundNets.has(minus) && !groundNets.has(plus)) net = plus;
    else if (groundNets.has(plus) && !groundNets.has(minus)) {
      net = minus;
      volts = -volts;
    }
    if (net === void 0 || byNet.has(net)) continue;
    byNet.set(net, { net, volts, from: value.from });
  }
  const unresolved = circuit.nets.filter((n) => n.isPower && !n.isGround && !byNet.has(n.name)).map((n) => n.name);
  const rails = [...byNet.values()].sort((a, b) => a.net.localeCompare(b.net));
  return { rails, unresolved };
}

// src/engine/context-limits.ts
var DEFAULT_VCE_SAT = 0.2;
var SPICE_DEFAULT_JFET_VTO = -2;
function saturationEdge(device, card, ratings2) {
  switch (device.kind) {
    case "bjt": {
      if (ratings2?.vceSat !== void 0) {
        const at = ratings2.vceSatAt ? ` at ${ratings2.vceSatAt}` : "";
        return { volts: ratings2.vceSat, basis: `datasheet VCE(sat) ${trim(ratings2.vceSat)} V${at}` };
      }
      return { volts: DEFAULT_VCE_SAT, basis: `VCE(sat) ${DEFAULT_VCE_SAT} V assumed (the usual small-signal datasheet figure; no rating known for this part)` };
    }
    case "jfet": {
      const vto = card?.params.VTO ?? SPICE_DEFAULT_JFET_VTO;
      const vtoReported = device.type === "pjfet" ? -vto : vto;
      const volts = Math.max(0, device.vgs - vtoReported);
      const from = card?.params.VTO !== void 0 ? `VTO ${trim(vtoReported)} V of card ${card.name}` : `SPICE's default VTO ${trim(vtoReported)} V (the card gives none)`;
      return { volts, basis: `VDS(sat) = VGS \u2212 VTO = ${signed(device.vgs)} \u2212 ${signed(vtoReported)} V, ${from}` };
    }
    case "mosfet": {
      const volts = Math.max(0, device.vgs - device.vth);
      return { volts, basis: `VDS(sat) = VGS \u2212 VTH = ${signed(device.vgs)} \u2212 ${signed(device.vth)} V at the operating point` };
    }
    case "diode":
      return void 0;
  }
}
function trim(v) {
  return String(Number(v.toPrecision(3)));
}
function signed(v) {
  const t = trim(Math.abs(v));
  return v < 0 ? `(\u2212${t})` : t;
}
function cardOf(elements, name) {
  const e = elements.find((x) => x.name === name);
  if (!e) return void 0;
  return e.kind === "Q" || e.kind === "J" || e.kind === "M" || e.kind === "D" ? e.model : void 0;
}
function partDissipation(part, op, voltageOf2) {
  if (part.kind === "resistor") {
    const ohms = part.parsed.number;
    const [a, b] = Object.values(part.pins);
    if (ohms === void 0 || !(ohms > 0) || a === void 0 || b === void 0) return void 0;
    const va = voltageOf2(a);
    const vb = voltageOf2(b);
    if (va === void 0 || vb === void 0) return void 0;
    return (va - vb) ** 2 / ohms;
  }
  const own = op.devices[part.ref];
  if (own) return own.power;
  const channels = [op.devices[`${part.ref}.g1`], op.devices[`${part.ref}.g2`]].filter((d) => d !== void 0);
  return channels.length > 0 ? channels.reduce((sum, d) => sum + d.power, 0) : void 0;
}
var CHIP_RESISTOR_WATTS = [
  ["01005", 1 / 32, "1/32 W"],
  ["0201", 1 / 20, "1/20 W"],
  ["0402", 1 / 16, "1/16 W"],
  ["0603", 1 / 10, "1/10 W"],
  ["0805", 1 / 8, "1/8 W"],
  ["1206", 1 / 4, "1/4 W"],
  ["1210", 1 / 2, "1/2 W"],
  ["2010", 3 / 4, "3/4 W"],
  ["2512", 1, "1 W"]
];
var THT_WATTS = 1 / 4;
function resistorPowerRating(part, fallbackWatts) {
  if (part.parsed.powerRating !== void 0) {
    return { watts: part.parsed.powerRating, basis: "the part's own rating, from its Value or Power field", assumed: false };
  }
  const fp = part.footprint;
  for (const [code, watts, text] of CHIP_RESISTOR_WATTS) {
    if (new RegExp(`(^|[^0-9])${code}([^0-9]|$)`).test(fp)) {
      return { watts, basis: `${code} chip resistor, ${text}: the usual rating for the size, common practice`, assumed: false };
    }
  }
  if (/THT|Axial|DIN0\d{3}/i.test(fp)) {
    return { watts: THT_WATTS, basis: "through-hole resistor, 1/4 W: the common size, common practice", assumed: false };
  }
  return { watts: fallbackWatts, basis: `no power rating or recognised footprint: ${fallbackWatts} W assumed`, assumed: true };
}

// src/solve/parasitics.ts
var PACKAGE_ROWS = [
  { pattern: /CP_EIA|Tantalum/i, construction: "tantalum", esl: 1e-8, basis: "moulded tantalum, taken as \u224810 nH like a small electrolytic [MEM]" },
  { pattern: /CP_Radial|CP_Elec|CP_Axial|(^|:)CP_/i, construction: "electrolytic", esl: 1e-8, basis: "radial aluminium electrolytic \u224810 nH (5\u201320 nH) [MEM]" },
  { pattern: /C_0201(_|$)/, construction: "mlcc", esl: 7e-10, basis: "MLCC 0201: the 0402 figure 0.7 nH used, no 0201 row in the table [DOC for 0402]" },
  { pattern: /C_0402(_|$)/, construction: "mlcc", esl: 7e-10, basis: "MLCC 0402 \u22480.7 nH [DOC: Q&A answer on MLCC self-resonance]" },
  { pattern: /C_0603(_|$)/, construction: "mlcc", esl: 9e-10, basis: "MLCC 0603 \u22480.9 nH [DOC: Q&A answer on MLCC self-resonance]" },
  { pattern: /C_0805(_|$)/, construction: "mlcc", esl: 11e-10, basis: "MLCC 0805 \u22481.1 nH [DOC: Q&A answer on MLCC self-resonance]" },
  { pattern: /C_1206(_|$)/, construction: "mlcc", esl: 14e-10, basis: "MLCC 1206 \u22481.4 nH [DOC: Q&A answer on MLCC self-resonance]" },
  { pattern: /C_(1210|1812|1825|2220|2225)(_|$)/, construction: "mlcc", esl: 14e-10, basis: "MLCC larger than 1206: the 1206 figure 1.4 nH used, larger cases are not in the table [DOC for 1206]" },
  { pattern: /C_Disc/i, construction: "disc", esl: 5e-9, basis: "leaded ceramic disc, short leads: 5 nH, the top of the quoted 2\u20135 nH; add \u22481 nH per mm of lead [DOC; the per-mm figure CP]" },
  { pattern: /C_Rect/i, construction: "film-box", esl: 1e-8, basis: "film box capacitor \u224810 nH (5\u201315 nH) [MEM]" },
  { pattern: /C_Axial/i, construction: "film-axial", esl: 15e-9, basis: "axial film capacitor 15 nH, the top of 5\u201315 nH (axial higher) [MEM]" }
];
var ELECTROLYTIC_VOLTS = [10, 16, 25, 35, 63];
var ELECTROLYTIC_ESR = [
  [1e-5, [20, 16, 14, 11, 9.3]],
  [22e-6, [9, 7.5, 6.2, 5.1, 4.2]],
  [47e-6, [4.2, 3.5, 2.9, 2.4, 2]],
  [1e-4, [2, 1.6, 1.4, 1.1, 0.93]],
  [22e-5, [0.9, 0.75, 0.62, 0.51, 0.42]],
  [47e-5, [0.42, 0.35, 0.29, 0.24, 0.2]],
  [1e-3, [0.2, 0.16, 0.14, 0.11, 0.09]]
];
var ELECTROLYTIC_SOURCE = "general-purpose electrolytic table of an ESR-meter user guide (reference-data \xA72.3, first figure) [DOC]";
var CERAMIC_ESR = [
  { maxFarads: 1e-9, esr: 0.2, basis: "C0G-class \u22641 nF: 0.2 \u03A9, middle of 0.1\u20130.3 \u03A9 [CP]" },
  { maxFarads: 1e-8, esr: 0.1, basis: "1\u201310 nF: 0.1 \u03A9, between the \u22641 nF (0.1\u20130.3 \u03A9) and 10\u2013100 nF (20\u201350 m\u03A9) rows [CP]" },
  { maxFarads: 999e-9, esr: 0.03, basis: "X7R-class 10 nF\u20131 \xB5F: 30 m\u03A9, middle of 20\u201350 m\u03A9 [CP]" },
  { maxFarads: Number.POSITIVE_INFINITY, esr: 7e-3, basis: "X7R-class \u22651 \xB5F: 7 m\u03A9, middle of 5\u201310 m\u03A9 [CP]" }
];
var FILM_ESR = { esr: 0.03, basis: "film: 30 m\u03A9, middle of 10\u201350 m\u03A9 [CP]" };
var NO_FOOTPRINT = {
  pattern: /$^/,
  construction: "unknown",
  esl: 11e-10,
  basis: "no recognised capacitor footprint: taken as an 0805 MLCC, 1.1 nH [DOC for 0805]"
};
function fieldValue2(part, name) {
  const want = name.toLowerCase();
  for (const [k, v] of Object.entries(part.fields)) {
    if (k.toLowerCase() === want && v.trim() !== "" && v.trim() !== "~") return v.trim();
  }
  return void 0;
}
function packageRow(part) {
  const fp = part.footprint;
  const row = PACKAGE_ROWS.find((r) => r.pattern.test(fp));
  if (row) return row;
  if (part.kind === "polarized-capacitor") {
    const electrolytic = PACKAGE_ROWS.find((r) => r.construction === "electrolytic");
    if (electrolytic) return { ...electrolytic, basis: `polarized capacitor taken as an ${electrolytic.basis}` };
  }
  return NO_FOOTPRINT;
}
function electrolyticEsr(farads, volts) {
  const c = farads ?? 0;
  let row = ELECTROLYTIC_ESR[0];
  for (const r of ELECTROLYTIC_ESR) if (c >= r[0] * (1 - 1e-9)) row = r;
  let col = 0;
  ELECTROLYTIC_VOLTS.forEach((v, i) => {
    if (volts !== void 0 && volts >= v * (1 - 1e-9)) col = i;
  });
  const esr = row?.[1][col] ?? 20;
  const rowText = formatQuantity(row?.[0] ?? 1e-5, "F");
  const colText = `${ELECTROLYTIC_VOLTS[col] ?? 10} V`;
  const notes = [];
  if (farads === void 0) notes.push("capacitance unknown");
  else if (farads < (ELECTROLYTIC_ESR[0]?.[0] ?? 1e-5) * (1 - 1e-9)) notes.push("below the table, its smallest row used");
  if (volts === void 0) notes.push("no voltage rating given, lowest column used");
  else if (volts < 10) notes.push("rated below the table's 10 V column");
  const extra = notes.length > 0 ? `; ${notes.join("; ")}` : "";
  return { esr, basis: `ESR ${formatQuantity(esr, "\u03A9")} from the ${rowText} / ${colText} entry of the ${ELECTROLYTIC_SOURCE}${extra}` };
}
function ceramicEsr(farads) {
  const c = farads ?? 1e-7;
  const row = CERAMIC_ESR.find((r) => c <= r.maxFarads) ?? CERAMIC_ESR[CERAMIC_ESR.length - 1];
  const esr = row?.esr ?? 0.03;
  const unknown = farads === void 0 ? " (capacitance unknown, 100 nF assumed)" : "";
  return { esr, basis: `ESR ${formatQuantity(esr, "\u03A9")}: ${row?.basis ?? ""}${unknown}` };
}
function estimateCapacitorParasitics(part) {
  const farads = part.parsed.number;
  const volts = part.parsed.voltageRating;
  const pkg = packageRow(part);
  let esrPart;
  switch (pkg.construction) {
    case "electrolytic":
      esrPart = electrolyticEsr(farads, volts);
      break;
    case "tantalum": {
      const e = electrolyticEsr(farads, volts);
      esrPart = { esr: e.esr, basis: `${e.basis}; tantalum read from the aluminium table, which overstates a tantalum's ESR [CP]` };
      break;
    }
    case "film-box":
    case "film-axial":
      esrPart = { esr: FILM_ESR.esr, basis: `ESR ${formatQuantity(FILM_ESR.esr, "\u03A9")}: ${FILM_ESR.basis}` };
      break;
    default:
      esrPart = ceramicEsr(farads);
  }
  let eslPart = { esl: pkg.esl, basis: `ESL ${formatQuantity(pkg.esl, "H")}: ${pkg.basis}` };
  const esrField = fieldValue2(part, "ESR");
  if (esrField !== void 0) {
    const v = parseQuantity(esrField, "\u03A9");
    if (typeof v === "number") esrPart = { esr: v, basis: `ESR ${formatQuantity(v, "\u03A9")} from the part's ESR field` };
    else esrPart = { ...esrPart, basis: `${esrPart.basis} (ESR field '${esrField}' not read: ${v.error})` };
  }
  const eslField = fieldValue2(part, "ESL");
  if (eslField !== void 0) {
    const v = parseQuantity(eslField, "H");
    if (typeof v === "number") eslPart = { esl: v, basis: `ESL ${formatQuantity(v, "H")} from the part's ESL field` };
    else eslPart = { ...eslPart, basis: `${eslPart.basis} (ESL field '${eslField}' not read: ${v.error})` };
  }
  return { esr: esrPart.esr, esl: eslPart.esl, basis: `${esrPart.basis}. ${eslPart.basis}` };
}
function selfResonantFrequency(farads, henries) {
  return 1 / (2 * Math.PI * Math.sqrt(farads * henries));
}

// src/solve/subckt-syntax.ts
var LETTER_NAMES = {
  E: "voltage-controlled voltage source",
  F: "current-controlled current source",
  G: "voltage-controlled current source",
  H: "current-controlled voltage source",
  B: "behavioural source",
  K: "coupled inductors",
  T: "transmission line",
  O: "lossy transmission line",
  U: "distributed RC line",
  S: "voltage-controlled switch",
  W: "current-controlled switch",
  A: "code model",
  Z: "MESFET",
  N: "device model",
  P: "coupled transmission line",
  Y: "transmission line"
};
var TRANSIENT_ONLY = /* @__PURE__ */ new Set(["IC", "OFF", "TEMP", "DTEMP"]);
function words(text) {
  return text.replace(/\s*=\s*/g, "=").split(/\s+/).filter((w) => w !== "");
}
function isKeyValue(w) {
  return /^[A-Za-z_][\w.]*=/.test(w);
}
function splitKeyValues(ws) {
  const positional = [];
  const keyed = /* @__PURE__ */ new Map();
  const flags = [];
  for (const w of ws) {
    if (isKeyValue(w)) {
      const eq = w.indexOf("=");
      keyed.set(w.slice(0, eq).toUpperCase(), w.slice(eq + 1));
    } else if (/^off$/i.test(w)) flags.push("OFF");
    else positional.push(w);
  }
  return { positional, keyed, flags };
}
function numberOf(raw, what) {
  const v = parseSpiceNumber(raw);
  return v === void 0 ? { problem: `cannot read ${what} '${raw}' as a number` } : v;
}
function readKeyed(keyed, allowed, ignorable) {
  const values = /* @__PURE__ */ new Map();
  const ignored = [];
  for (const [key, raw] of keyed) {
    if (allowed.includes(key)) {
      const v = numberOf(raw, key);
      if (typeof v !== "number") return v;
      values.set(key, v);
    } else if (ignorable.includes(key) || TRANSIENT_ONLY.has(key)) ignored.push(`${key}=${raw}`);
    else return { problem: `instance parameter ${key}=${raw} is not supported` };
  }
  return { values, ignored };
}
function readPassive(kind, name, line, rest) {
  const { positional, keyed, flags } = splitKeyValues(rest);
  const [a, b, valueWord] = positional;
  if (a === void 0 || b === void 0) return { problem: `${name} needs two nodes and a value, as in '${name} 1 2 10k'` };
  const valueKey = { R: ["R", "RESISTANCE"], C: ["C", "CAPACITANCE"], L: ["L", "INDUCTANCE"] }[kind];
  const rawValue = valueWord ?? valueKey.map((k) => keyed.get(k)).find((v) => v !== void 0);
  for (const k of valueKey) keyed.delete(k);
  if (rawValue === void 0) return { problem: `${name} has no value` };
  if (positional.length > 3) return { problem: `${name}: '${positional.slice(3).join(" ")}' after the value is not supported (semiconductor resistors and capacitors need a model we do not have)` };
  const value = numberOf(rawValue, `the value of ${name}`);
  if (typeof value !== "number") return value;
  const extra = readKeyed(keyed, ["M"], ["TC", "TC1", "TC2", "NOISY", "SCALE", "AC"]);
  if ("problem" in extra) return extra;
  const m = extra.values.get("M") ?? 1;
  if (!(m > 0)) return { problem: `${name}: multiplier M=${m} must be positive` };
  const scaled = kind === "C" ? value * m : value / m;
  return { statement: { kind, name, line, nodes: [a.toUpperCase(), b.toUpperCase()], value: scaled }, ignored: [...extra.ignored, ...flags] };
}
function readSource(kind, name, line, rest) {
  const [pos, neg, ...spec] = rest;
  if (pos === void 0 || neg === void 0) return { problem: `${name} needs two nodes, as in '${name} 1 0 DC 5'` };
  const text = spec.join(" ");
  const read = text.trim() === "" ? { dc: 0 } : parseSourceSpec(text);
  if ("error" in read) return { problem: `${name}: ${read.error}` };
  const ignored = read.waveform !== void 0 ? [`${read.waveform} waveform (its value at time zero, ${read.dc ?? 0}, is used)`] : [];
  return {
    statement: { kind, name, line, nodes: [pos.toUpperCase(), neg.toUpperCase()], dc: read.dc ?? 0, ...read.ac !== void 0 ? { ac: read.ac } : {} },
    ignored
  };
}
var DEVICE_NODES = { D: 2, J: 3, M: 4 };
function readDevice(kind, name, line, rest) {
  const { positional, keyed, flags } = splitKeyValues(rest);
  let nodeCount;
  if (kind === "Q") {
    const fifth = positional[4];
    nodeCount = positional.length >= 6 || fifth !== void 0 && parseSpiceNumber(fifth) === void 0 ? 4 : 3;
  } else nodeCount = DEVICE_NODES[kind];
  const nodes = positional.slice(0, nodeCount).map((n) => n.toUpperCase());
  const model = positional[nodeCount];
  if (nodes.length < nodeCount || model === void 0) {
    const example = { D: "D1 A K DMOD", Q: "Q1 C B E QMOD", J: "J1 D G S JMOD", M: "M1 D G S B MMOD" }[kind];
    return { problem: `${name} needs ${nodeCount} nodes and a model name, as in '${example}'` };
  }
  const after = positional.slice(nodeCount + 1);
  if (after.length > (kind === "M" ? 0 : 1)) return { problem: `${name}: '${after.join(" ")}' after the model name is not understood` };
  if (kind === "M") {
    const m = keyed.get("M");
    if (m !== void 0 && parseSpiceNumber(m) !== 1) return { problem: `${name}: the MOSFET multiplier M=${m} is not supported; write the copies out` };
    keyed.delete("M");
  }
  const allowed = kind === "M" ? ["W", "L"] : ["AREA", "M"];
  const ignorable = kind === "M" ? ["AD", "AS", "PD", "PS", "NRD", "NRS"] : [];
  const extra = readKeyed(keyed, allowed, ignorable);
  if ("problem" in extra) return { problem: `${name}: ${extra.problem}` };
  const statement = { kind, name, line, nodes, model: model.toUpperCase() };
  if (kind === "M") {
    const w = extra.values.get("W");
    const l = extra.values.get("L");
    if (w !== void 0) statement.w = w;
    if (l !== void 0) statement.l = l;
  } else {
    const positionalArea = after[0] !== void 0 ? numberOf(after[0], `the area of ${name}`) : void 0;
    if (positionalArea !== void 0 && typeof positionalArea !== "number") return positionalArea;
    const area = (positionalArea ?? extra.values.get("AREA") ?? 1) * (extra.values.get("M") ?? 1);
    if (!(area > 0)) return { problem: `${name}: area ${area} must be positive` };
    if (area !== 1) statement.area = area;
  }
  const ignored = [...extra.ignored, ...flags];
  if (kind === "Q" && nodeCount === 4) ignored.push(`substrate node ${nodes[3]} (the Gummel\u2013Poon model here has no substrate junction)`);
  if (kind === "Q") statement.nodes = nodes.slice(0, 3);
  return { statement, ignored };
}
function readInstance(name, line, rest) {
  if (rest.some((w) => isKeyValue(w) || /^params:$/i.test(w))) {
    return { problem: `${name}: parameters passed to a subcircuit are not supported (expressions are not evaluated)` };
  }
  const subckt = rest[rest.length - 1];
  if (subckt === void 0) return { problem: `${name} needs its nodes and a subcircuit name, as in '${name} 1 2 3 SUBNAME'` };
  return { statement: { kind: "X", name, line, nodes: rest.slice(0, -1).map((n) => n.toUpperCase()), subckt: subckt.toUpperCase() }, ignored: [] };
}
function readSubcktStatement(text, line) {
  if (/[{}']/.test(text)) return { problem: "expressions ({\u2026} or '\u2026') are not evaluated; write the numbers out" };
  const [first, ...rest] = words(text);
  const name = (first ?? "").toUpperCase();
  const letter = name.charAt(0);
  switch (letter) {
    case "R":
    case "C":
    case "L":
      return readPassive(letter, name, line, rest);
    case "V":
    case "I":
      return readSource(letter, name, line, rest);
    case "D":
    case "Q":
    case "J":
    case "M":
      return readDevice(letter, name, line, rest);
    case "X":
      return readInstance(name, line, rest);
    default: {
      const what = LETTER_NAMES[letter];
      return { problem: `element ${name}${what ? ` (${what})` : ""} is not supported in a subcircuit; supported: R, C, L, V, I, D, Q, J, M and X` };
    }
  }
}
function readSubcktHeader(text) {
  const ws = words(text).slice(1);
  const name = ws[0] ?? "";
  const rest = ws.slice(1);
  const paramsAt = rest.findIndex((w) => isKeyValue(w) || /^params:/i.test(w));
  const pins = (paramsAt < 0 ? rest : rest.slice(0, paramsAt)).map((p) => p.toUpperCase());
  if (name === "") return { name: "?", pins, problem: "a .subckt line needs a name and its pins, as in '.subckt NAME A B C'" };
  if (paramsAt >= 0) return { name, pins, problem: `subcircuit ${name} takes parameters ('${rest.slice(paramsAt).join(" ")}'): parameters and expressions are not supported` };
  if (pins.length === 0) return { name, pins, problem: `subcircuit ${name} has no pins` };
  const seen = /* @__PURE__ */ new Set();
  for (const p of pins) {
    if (seen.has(p)) return { name, pins, problem: `subcircuit ${name} names pin ${p} twice` };
    seen.add(p);
  }
  return { name, pins };
}
function findSubcircuit(defs, name) {
  const want = name.trim().toUpperCase();
  return defs.find((d) => d.name.toUpperCase() === want);
}

// src/solve/spice-card.ts
var SUPPORTED = {
  D: "D",
  NPN: "NPN",
  PNP: "PNP",
  NJF: "NJF",
  PJF: "PJF",
  NMOS: "NMOS",
  PMOS: "PMOS"
};
var TEXT_PARAMS = /* @__PURE__ */ new Set(["MFG", "TYPE", "ICRATING_UNIT", "VERSION"]);
function stripInlineComment(line) {
  let out = line;
  const semi = out.indexOf(";");
  if (semi >= 0) out = out.slice(0, semi);
  const dollar = out.search(/(^|\s)\$/);
  if (dollar >= 0) out = out.slice(0, dollar);
  return out;
}
function statements(text) {
  const out = [];
  const lines = text.split(/\r\n|\r|\n/);
  lines.forEach((raw, i) => {
    const trimmed = raw.trim();
    if (trimmed === "" || trimmed.startsWith("*")) return;
    const body = stripInlineComment(trimmed).trim();
    if (body === "") return;
    if (body.startsWith("+")) {
      const last = out[out.length - 1];
      if (last) last.text += ` ${body.slice(1)}`;
      else out.push({ line: i + 1, text: body.slice(1) });
      return;
    }
    out.push({ line: i + 1, text: body });
  });
  return out;
}
function words2(text) {
  const spaced = text.replace(/[(),]/g, " ").replace(/\s*=\s*/g, "=");
  return spaced.split(/\s+/).filter((w) => w !== "");
}
function parseModelStatement(st, sourceName, notes) {
  const ws = words2(st.text);
  const name = ws[1];
  let typeWord = ws[2];
  if (name === void 0 || typeWord === void 0) {
    notes.push({ line: st.line, message: "a .model card needs a name and a type, as in '.model Q1 NPN(IS=1e-15 BF=100)'" });
    return void 0;
  }
  if (/^ako:/i.test(typeWord)) {
    notes.push({ line: st.line, message: `model ${name}: 'AKO' cards (a kind of another model) are not supported` });
    return void 0;
  }
  typeWord = typeWord.toUpperCase();
  const type = SUPPORTED[typeWord];
  if (!type) {
    notes.push({ line: st.line, message: `model ${name}: type ${typeWord} is not supported (supported: D, NPN, PNP, NJF, PJF, NMOS and PMOS level 1)` });
    return void 0;
  }
  const params = {};
  for (const w of ws.slice(3)) {
    const eq = w.indexOf("=");
    if (eq <= 0) {
      notes.push({ line: st.line, message: `model ${name}: '${w}' is not a PARAMETER=value pair; ignored` });
      continue;
    }
    const key = w.slice(0, eq).toUpperCase();
    const raw = w.slice(eq + 1);
    const value = parseSpiceNumber(raw);
    if (value === void 0) {
      if (!TEXT_PARAMS.has(key)) notes.push({ line: st.line, message: `model ${name}: cannot read ${key}='${raw}' as a number; ignored` });
      continue;
    }
    params[key] = value;
  }
  const level = params.LEVEL;
  if (level !== void 0 && level !== 1) {
    const what = type === "NMOS" || type === "PMOS" ? "only LEVEL=1 (Shichman\u2013Hodges) MOSFETs are supported" : `only level 1 ${type} models are supported`;
    notes.push({ line: st.line, message: `model ${name}: LEVEL=${level}: ${what}` });
    return void 0;
  }
  return { name, type, params, source: `${sourceName}, line ${st.line}` };
}
var SubcktCollector = class {
  constructor(st, sourceName, notes) {
    this.notes = notes;
    const header = readSubcktHeader(st.text);
    this.def = { name: header.name, pins: header.pins, statements: [], models: [], problems: [], ignored: [], line: st.line, source: sourceName };
    if (header.problem) this.def.problems.push({ line: st.line, message: header.problem });
  }
  notes;
  def;
  /** Depth of `.subckt` definitions written inside this one (not supported; skipped to their `.ends`). */
  nested = 0;
  names = /* @__PURE__ */ new Map();
  /** Takes one statement; true when it closed the block. */
  take(st, first) {
    const def = this.def;
    if (this.nested > 0) {
      if (first === ".ends") this.nested--;
      else if (first === ".subckt") this.nested++;
      return false;
    }
    switch (first) {
      case ".ends":
        return true;
      case ".subckt":
        this.nested++;
        def.problems.push({ line: st.line, message: `a subcircuit defined inside subcircuit ${def.name} is not supported; define it at the top level` });
        return false;
      case ".model": {
        const card = parseModelStatement(st, def.source, this.notes);
        if (card) def.models.push(card);
        return false;
      }
      case ".param":
      case ".func":
      case ".include":
      case ".inc":
      case ".lib":
        def.problems.push({ line: st.line, message: `'${first}' inside subcircuit ${def.name} is not supported (parameters and expressions are not evaluated, other files are not read)` });
        return false;
      default:
        break;
    }
    if (first.startsWith(".")) {
      def.ignored.push({ line: st.line, message: `'${first}' inside subcircuit ${def.name} has no effect on the operating point or the small-signal sweep; ignored` });
      return false;
    }
    const read = readSubcktStatement(st.text, st.line);
    if ("problem" in read) {
      def.problems.push({ line: st.line, message: read.problem });
      return false;
    }
    const earlier = this.names.get(read.statement.name);
    if (earlier !== void 0) {
      def.problems.push({ line: st.line, message: `${read.statement.name} is defined again in subcircuit ${def.name} (first at line ${earlier})` });
      return false;
    }
    this.names.set(read.statement.name, st.line);
    def.statements.push(read.statement);
    for (const what of read.ignored) def.ignored.push({ line: st.line, message: `${read.statement.name}: ${what} ignored` });
    return false;
  }
};
function parseModelCards(text, sourceName = "model text") {
  const models = [];
  const subcircuits = [];
  const notes = [];
  const seen = /* @__PURE__ */ new Map();
  const seenSubckt = /* @__PURE__ */ new Map();
  let open;
  for (const st of statements(text)) {
    const first = (st.text.split(/\s+/)[0] ?? "").toLowerCase();
    if (open) {
      if (!open.take(st, first)) continue;
      const def = open.def;
      open = void 0;
      const key = def.name.toUpperCase();
      const earlier = seenSubckt.get(key);
      if (earlier !== void 0) notes.push({ line: def.line, message: `subcircuit ${def.name} is defined again (first at line ${earlier}); the first is used` });
      else {
        seenSubckt.set(key, def.line);
        subcircuits.push(def);
      }
      continue;
    }
    switch (first) {
      case ".model": {
        const card = parseModelStatement(st, sourceName, notes);
        if (!card) break;
        const key = card.name.toUpperCase();
        const earlier = seen.get(key);
        if (earlier !== void 0) {
          notes.push({ line: st.line, message: `model ${card.name} is defined again (first at line ${earlier}); the first is used` });
          break;
        }
        seen.set(key, st.line);
        models.push(card);
        break;
      }
      case ".subckt":
        open = new SubcktCollector(st, sourceName, notes);
        break;
      case ".ends":
        notes.push({ line: st.line, message: "'.ends' without a '.subckt' before it; ignored" });
        break;
      case ".lib":
      case ".endl":
      case ".end":
      case ".title":
        break;
      case ".include":
      case ".inc":
      case ".param":
        notes.push({ line: st.line, message: `'${first}' is not followed; only .model cards and .subckt blocks in this text are read` });
        break;
      default:
        notes.push({ line: st.line, message: `'${st.text.slice(0, 40)}' is not a .model card or inside a .subckt block; ignored` });
    }
  }
  if (open) notes.push({ line: open.def.line, message: `subcircuit ${open.def.name} has no .ends; not used` });
  return { models, subcircuits, notes };
}
function findModelCard(models, name) {
  const want = name.trim().toUpperCase();
  return models.find((m) => m.name.toUpperCase() === want);
}

// src/solve/parts/library.ts
var GP_SOURCE = "Gummel\u2013Poon card dated 1988 in a semiconductor vendor's library, carried identically by many public repositories (the majority card; corrupted copies avoided) [DOC, reference-data \xA74.1]";
var Q2N3904 = {
  name: "2N3904",
  type: "NPN",
  params: {
    IS: 6734e-18,
    XTI: 3,
    EG: 1.11,
    VAF: 74.03,
    BF: 416.4,
    NE: 1.259,
    ISE: 6734e-18,
    IKF: 0.06678,
    XTB: 1.5,
    BR: 0.7371,
    NC: 2,
    ISC: 0,
    IKR: 0,
    RC: 1,
    CJC: 3638e-15,
    MJC: 0.3085,
    VJC: 0.75,
    FC: 0.5,
    CJE: 4493e-15,
    MJE: 0.2593,
    VJE: 0.75,
    TR: 2395e-10,
    TF: 3012e-13,
    ITF: 0.4,
    VTF: 4,
    XTF: 2,
    RB: 10,
    NF: 1,
    RE: 0
  },
  source: GP_SOURCE
};
var Q2N2222A = {
  name: "2N2222A",
  type: "NPN",
  params: {
    IS: 1434e-17,
    XTI: 3,
    EG: 1.11,
    VAF: 74.03,
    BF: 255.9,
    NE: 1.307,
    ISE: 1434e-17,
    IKF: 0.2847,
    XTB: 1.5,
    BR: 6.092,
    NC: 2,
    ISC: 0,
    IKR: 0,
    RC: 1,
    CJC: 7306e-15,
    MJC: 0.3416,
    VJC: 0.75,
    FC: 0.5,
    CJE: 2201e-14,
    MJE: 0.377,
    VJE: 0.75,
    TR: 4691e-11,
    TF: 4111e-13,
    ITF: 0.6,
    VTF: 1.7,
    XTF: 3,
    RB: 10,
    NF: 1,
    RE: 0
  },
  source: GP_SOURCE
};
var Q2N3906 = {
  name: "2N3906",
  type: "PNP",
  params: {
    IS: 141e-17,
    XTI: 3,
    EG: 1.11,
    VAF: 18.7,
    BF: 180.7,
    NE: 1.5,
    ISE: 0,
    IKF: 0.08,
    XTB: 1.5,
    BR: 4.977,
    NC: 2,
    ISC: 0,
    IKR: 0,
    RC: 2.5,
    CJC: 9728e-15,
    MJC: 0.5776,
    VJC: 0.75,
    FC: 0.5,
    CJE: 8063e-15,
    MJE: 0.3677,
    VJE: 0.75,
    TR: 3342e-11,
    TF: 1793e-13,
    ITF: 0.4,
    VTF: 4,
    XTF: 6,
    RB: 10,
    NF: 1,
    RE: 0
  },
  source: GP_SOURCE
};
var Q2N918_ESTIMATE = {
  name: "2N918",
  type: "NPN",
  params: { IS: 1e-15, BF: 60, VAF: 50, CJE: 24e-13, VJE: 0.75, MJE: 0.33, CJC: 3e-12, VJC: 0.75, MJC: 0.21, TF: 155e-12, RB: 50 },
  source: "ESTIMATE, not a published model: derived by the notes' author from 2N918 datasheet limits (hFE \u2265 20, fT \u2265 600 MHz, Cobo \u2264 3 pF; TF from 1/(2\u03C0\xB7900 MHz) less junction charging) [reference-data \xA74.1]"
};
var J310 = {
  name: "J310",
  type: "NJF",
  params: {
    BETA: 3384e-6,
    VTO: -3.409,
    LAMBDA: 0.017,
    IS: 1939e-16,
    ISR: 1881e-15,
    N: 1,
    NR: 2,
    RD: 1,
    RS: 1,
    CGD: 62e-13,
    CGS: 62e-13,
    PB: 1,
    M: 0.465,
    FC: 0.5
  },
  source: "card in a simulator's default JFET library, reproduced in several repositories [DOC, reference-data \xA74.2]; implies IDSS 39.3 mA [CALC], inside the 24\u201360 mA limits"
};
var J2N3819 = {
  name: "2N3819",
  type: "NJF",
  params: {
    BETA: 1304e-6,
    VTO: -3,
    LAMBDA: 225e-5,
    IS: 3357e-17,
    ISR: 3224e-16,
    RD: 1,
    RS: 1,
    CGD: 16e-13,
    CGS: 2414e-15,
    M: 0.3622,
    PB: 1
  },
  source: "2N3819 card in a simulator's default JFET library [DOC, reference-data \xA74.2]; implies IDSS 11.7 mA, |VP| 3 V [CALC]"
};
var MPF102_STANDIN = {
  ...J2N3819,
  name: "MPF102",
  source: "STAND-IN: the 2N3819 card of a simulator's default JFET library [DOC], used for the MPF102 class because no trustworthy MPF102 card was found; it implies IDSS 11.7 mA and |VP| 3 V, inside the MPF102 limits (2\u201320 mA, |VGS(off)| \u2264 8 V) [reference-data \xA74.2]"
};
var J2N5484_ESTIMATE = {
  name: "2N5484",
  type: "NJF",
  params: { VTO: -1.5, BETA: 1333e-6, LAMBDA: 0.01, RD: 10, RS: 10, CGS: 4e-12, CGD: 4e-12 },
  source: "ESTIMATE, not a published model: mid-range of the 2N5484 datasheet (IDSS 3 mA at VP \u22121.5 V, BETA = IDSS/VP\xB2) with the circulating card's LAMBDA, RD, RS and CGS = CGD \u2248 4 pF; the circulating card itself (BETA 3m \u2192 IDSS 6.75 mA) is outside the 1\u20135 mA limits [reference-data \xA74.2]"
};
var J2N5486_ESTIMATE = {
  name: "2N5486",
  type: "NJF",
  params: { VTO: -4, BETA: 875e-6, LAMBDA: 0.01, RD: 10, RS: 10, CGS: 4e-12, CGD: 4e-12 },
  source: "ESTIMATE, not a published model: mid-range of the 2N5486 datasheet (IDSS 14 mA at VP \u22124 V) with the circulating card's LAMBDA, RD, RS, CGS, CGD; the circulating card itself (IDSS 64 mA) is outside the 8\u201320 mA limits [reference-data \xA74.2]"
};
var M2N7000 = {
  name: "2N7000",
  type: "NMOS",
  params: {
    LEVEL: 1,
    VTO: 2.094,
    KP: 0.2628,
    LAMBDA: 0.01147,
    GAMMA: 0,
    PHI: 0.6,
    RD: 1.083,
    RS: 0.5333,
    CBD: 3735e-14,
    CBS: 3479e-14,
    CGSO: 5117e-14,
    CGDO: 197e-13,
    CGBO: 9582e-14,
    IS: 4375e-17,
    PB: 0.8,
    MJ: 0.46,
    FC: 0.5,
    RSH: 27.94
  },
  source: "level-1 card circulating for the 2N7000 (repository copy, origin not identified) [DOC, reference-data \xA74.3]; KP agrees with the datasheet's typical gfs 320 mS at 200 mA (KP = gfs\xB2/2ID \u2248 0.256) [CALC]"
};
var DUAL_GATE_DC = { LEVEL: 1, VTO: -0.8, KP: 0.0288, LAMBDA: 0.01, GAMMA: 0, PHI: 0.6 };
var DUAL_GATE_DC_SOURCE = "ESTIMATE, not a published model: each of the two channels of a BF998-class dual-gate depletion MOSFET as a level-1 card, VTO \u22120.8 V (typical pinch-off) and KP 0.0288 A/V\xB2 from gfs 24 mS at 10 mA [CALC from datasheet typicals, reference-data \xA74.4]; LAMBDA is a guess";
function perMetreOfWidth(farads) {
  return farads / DEFAULT_CHANNEL_SIZE;
}
var W_UM = Number((DEFAULT_CHANNEL_SIZE * 1e6).toPrecision(6));
function nanofaradsPerMetre(farads) {
  return String(Number((perMetreOfWidth(farads) * 1e9).toPrecision(4)));
}
var BF998_CG1SS = 21e-13;
var BF998_CG2SS = 12e-13;
var BF998_CDG1 = 25e-15;
var DUAL_GATE_CHANNEL = {
  name: "BF998",
  type: "NMOS",
  params: { ...DUAL_GATE_DC, CGSO: perMetreOfWidth(BF998_CG1SS), CGDO: perMetreOfWidth(BF998_CDG1) },
  source: `${DUAL_GATE_DC_SOURCE}; gate-1 channel capacitances ESTIMATED from the datasheet typicals Cg1ss 2.1 pF and Cdg1 25 fF [DOC, reference-data \xA74.4] as level-1 overlaps per metre of the default channel width W = ${W_UM} \xB5m [CALC]: CGSO = 2.1 pF / ${W_UM} \xB5m = ${nanofaradsPerMetre(BF998_CG1SS)} nF/m, CGDO = 25 fF / ${W_UM} \xB5m = ${nanofaradsPerMetre(BF998_CDG1)} nF/m (C_gd to the node between the channels)`
};
var DUAL_GATE_CHANNEL_G2 = {
  name: "BF998_G2",
  type: "NMOS",
  params: { ...DUAL_GATE_DC, CGSO: perMetreOfWidth(BF998_CG2SS) },
  source: `${DUAL_GATE_DC_SOURCE}; gate-2 channel capacitance ESTIMATED from the datasheet typical Cg2ss 1.2 pF [DOC, reference-data \xA74.4] as a level-1 overlap per metre of the default channel width W = ${W_UM} \xB5m [CALC]: CGSO = 1.2 pF / ${W_UM} \xB5m = ${nanofaradsPerMetre(BF998_CG2SS)} nF/m; no gate-2\u2013drain figure in our notes, CGDO 0`
};
var BF992_CG1SS = 4e-12;
var BF992_CRS = 3e-14;
var BF992_DC_SOURCE = `${DUAL_GATE_DC_SOURCE}; used for the BF992 (|yfs| 25 mS at 15 mA, similar)`;
var BF992_CHANNEL = {
  name: "BF992",
  type: "NMOS",
  params: { ...DUAL_GATE_DC, CGSO: perMetreOfWidth(BF992_CG1SS), CGDO: perMetreOfWidth(BF992_CRS) },
  source: `${BF992_DC_SOURCE}; gate-1 channel capacitances ESTIMATED from the BF992's Cig1-s 4 pF and Crs 30 fF [DOC, reference-data \xA74.4] per metre of W = ${W_UM} \xB5m [CALC]: CGSO = ${nanofaradsPerMetre(BF992_CG1SS)} nF/m, CGDO = ${nanofaradsPerMetre(BF992_CRS)} nF/m`
};
var BF992_CHANNEL_G2 = {
  ...DUAL_GATE_CHANNEL_G2,
  name: "BF992_G2",
  source: `${BF992_DC_SOURCE}; gate-2 channel capacitance STAND-IN: the BF998's Cg2ss 1.2 pF (no BF992 gate-2 figure in our notes) as CGSO = ${nanofaradsPerMetre(BF998_CG2SS)} nF/m at W = ${W_UM} \xB5m [CALC]`
};
var DUAL_GATE_PROTECTION = {
  name: "BF998-GATE-DIODE",
  type: "D",
  params: { IS: 1e-14, N: 1, BV: 9.3, IBV: 0.01 },
  source: "ESTIMATE: one diode of the integrated back-to-back gate protection pair; the pair breaks down at \u22480.7 V + 9.3 V = 10 V at 10 mA, the middle of the datasheet's V(BR)G1SS/G2SS \xB18 to \xB112 V [DOC for the range, reference-data \xA74.4]"
};
var D1N4148 = {
  name: "1N4148",
  type: "D",
  params: { IS: 4352e-12, N: 1.906, BV: 110, IBV: 1e-4, RS: 0.6458, CJO: 7048e-16, VJ: 0.869, M: 0.03, FC: 0.5, TT: 348e-11 },
  source: "the 1N4148 PSPICE model file of a semiconductor vendor (VRRM 100 V, IFRM 450 mA in its header), reproduced in public repositories [DOC]; another vendor's card groups the 1N914 and 1N4448 with the 1N4148 [DOC]"
};
var PARTS = [
  {
    name: "2N3904",
    aliases: ["PN3904", "Q2N3904", "2N3904BU", "2N3904TA"],
    kind: "npn",
    model: Q2N3904,
    ratings: {
      vceo: 40,
      vcbo: 60,
      vebo: 6,
      icMax: 0.2,
      ptot: 0.625,
      vceSat: 0.2,
      vceSatAt: "IC 10 mA, IB 1 mA",
      hfe: { min: 100, max: 300 },
      ft: 3e8,
      source: "2N3904 datasheet: VCEO 40 V, VCBO 60 V, VEBO 6 V, IC 200 mA, Ptot 625 mW (TO-92), VCE(sat) \u2264 0.2 V at 10/1 mA, hFE 100\u2013300 at 10 mA [DOC, reference-data \xA74.5]"
    }
  },
  {
    name: "MMBT3904",
    aliases: ["SMBT3904"],
    kind: "npn",
    model: { ...Q2N3904, name: "MMBT3904" },
    ratings: {
      vceo: 40,
      vcbo: 60,
      vebo: 6,
      icMax: 0.2,
      ptot: 0.35,
      vceSat: 0.2,
      vceSatAt: "IC 10 mA, IB 1 mA",
      source: "SOT-23 version of the 2N3904: same die ratings [DOC for the 2N3904]; Ptot 350 mW for SOT-23 [MEM]"
    }
  },
  {
    name: "2N2222A",
    aliases: ["PN2222A", "P2N2222A", "Q2N2222A", "MPS2222A"],
    kind: "npn",
    model: Q2N2222A,
    ratings: {
      vceo: 40,
      vcbo: 75,
      vebo: 6,
      icMax: 0.6,
      ptot: 0.625,
      vceSat: 0.3,
      vceSatAt: "IC 150 mA, IB 15 mA",
      hfe: { min: 100, max: 300 },
      ft: 3e8,
      source: "2N2222A datasheet: VCEO 40 V, VCBO 75 V, VEBO 6 V, IC 600 mA, Ptot 625 mW (TO-92) [DOC]; VCE(sat), hFE and fT [MEM] (reference-data \xA74.5)"
    }
  },
  {
    name: "MMBT2222A",
    aliases: [],
    kind: "npn",
    model: { ...Q2N2222A, name: "MMBT2222A" },
    ratings: {
      vceo: 40,
      vcbo: 75,
      vebo: 6,
      icMax: 0.6,
      ptot: 0.35,
      vceSat: 0.3,
      vceSatAt: "IC 150 mA, IB 15 mA",
      source: "SOT-23 version of the 2N2222A: die ratings as the 2N2222A [DOC]; Ptot 350 mW for SOT-23 [MEM]"
    }
  },
  {
    // Not an alias of the 2N2222A: lower VCEO and VEBO (reference-data §4.5).
    name: "2N2222",
    aliases: ["PN2222", "Q2N2222"],
    kind: "npn",
    model: { ...Q2N2222A, name: "2N2222", source: `${GP_SOURCE}; the 2N2222A card, used for the non-A part (same die family, lower ratings)` },
    ratings: {
      vceo: 30,
      vcbo: 60,
      vebo: 5,
      icMax: 0.8,
      ptot: 0.5,
      vceSat: 0.4,
      vceSatAt: "IC 150 mA, IB 15 mA",
      hfe: { min: 100, max: 300 },
      source: "2N2222 (non-A, TO-18) datasheet: VCEO 30 V, VCBO 60 V, VEBO 5 V, IC 800 mA, Ptot 500 mW, VCE(sat) \u2264 0.4 V at 150/15 mA [DOC, reference-data \xA74.5]"
    }
  },
  {
    name: "2N3906",
    aliases: ["PN3906", "Q2N3906", "2N3906BU", "2N3906TA"],
    kind: "pnp",
    model: Q2N3906,
    ratings: {
      vceo: 40,
      vcbo: 40,
      vebo: 5,
      icMax: 0.2,
      ptot: 0.625,
      vceSat: 0.25,
      vceSatAt: "IC 10 mA, IB 1 mA",
      hfe: { min: 100, max: 300 },
      ft: 25e7,
      source: "2N3906 ratings from memory of the datasheet: VCEO/VCBO \u221240 V, VEBO \u22125 V, IC \u2212200 mA, Ptot 625 mW, VCE(sat) \u2264 \u22120.25 V at 10/1 mA [MEM, reference-data \xA74.5]"
    }
  },
  {
    name: "MMBT3906",
    aliases: ["SMBT3906"],
    kind: "pnp",
    model: { ...Q2N3906, name: "MMBT3906" },
    ratings: {
      vceo: 40,
      vcbo: 40,
      vebo: 5,
      icMax: 0.2,
      ptot: 0.35,
      vceSat: 0.25,
      vceSatAt: "IC 10 mA, IB 1 mA",
      source: "SOT-23 version of the 2N3906 [MEM for all figures]"
    }
  },
  {
    name: "2N918",
    aliases: ["Q2N918"],
    kind: "npn",
    model: Q2N918_ESTIMATE,
    ratings: {
      vceo: 15,
      vcbo: 30,
      vebo: 3,
      icMax: 0.05,
      ptot: 0.2,
      vceSat: 0.4,
      vceSatAt: "IC 10 mA, IB 1 mA",
      hfe: { min: 20 },
      ft: 6e8,
      source: "2N918 datasheets: VCEO(sus) 15 V, BVCBO 30 V, BVEBO 3 V, VCE(sat) \u2264 0.4 V, fT \u2265 600 MHz [DOC]; IC 50 mA and Ptot 200 mW [MEM] (reference-data \xA74.1, \xA74.5)"
    }
  },
  {
    name: "J310",
    aliases: ["J-310"],
    kind: "njfet",
    model: J310,
    ratings: {
      vds: 25,
      vgsMax: 25,
      igMax: 0.01,
      ptot: 0.35,
      idss: { min: 0.024, max: 0.06 },
      vgsOff: { min: -6.5, max: -2 },
      source: "J310 datasheet: V(BR)GSS \u221225 V, VDS 25 V, IG(f) 10 mA, PD 350 mW (TO-92), IDSS 24\u201360 mA, VGS(off) \u22122.0 to \u22126.5 V [DOC, reference-data \xA74.2]"
    }
  },
  {
    name: "MMBFJ310",
    aliases: [],
    kind: "njfet",
    model: { ...J310, name: "MMBFJ310" },
    ratings: {
      vds: 25,
      vgsMax: 25,
      igMax: 0.01,
      idss: { min: 0.024, max: 0.06 },
      vgsOff: { min: -6.5, max: -2 },
      source: "SOT-23 version of the J310: die ratings as the J310 [DOC]; its package dissipation is lower than the TO-92 350 mW and is not compiled here"
    }
  },
  {
    name: "2N3819",
    aliases: [],
    kind: "njfet",
    model: J2N3819,
    ratings: { source: "no 2N3819 ratings compiled in reference-data; only the model card" }
  },
  {
    name: "MPF102",
    aliases: [],
    kind: "njfet",
    model: MPF102_STANDIN,
    ratings: {
      vds: 25,
      vdg: 25,
      vgsMax: 25,
      igMax: 0.01,
      ptot: 0.35,
      idss: { min: 2e-3, max: 0.02 },
      vgsOff: { min: -8 },
      source: "MPF102 datasheet: VDS, VDG 25 V, V(BR)GSS \u221225 V, IG(f) 10 mA, PD 350 mW, IDSS 2\u201320 mA, VGS(off) to \u22128 V [DOC, reference-data \xA74.2]"
    }
  },
  {
    name: "2N5484",
    aliases: [],
    kind: "njfet",
    model: J2N5484_ESTIMATE,
    ratings: {
      vgsMax: 25,
      igMax: 0.01,
      ptot: 0.35,
      idss: { min: 1e-3, max: 5e-3 },
      vgsOff: { min: -3, max: -0.3 },
      source: "2N5484: IDSS 1\u20135 mA, VGS(off) \u22120.3 to \u22123 V, V(BR)GSS \u221225 V [MEM]; IG(f) 10 mA, PD 350 mW [DOC] (reference-data \xA74.2)"
    }
  },
  {
    name: "2N5486",
    aliases: [],
    kind: "njfet",
    model: J2N5486_ESTIMATE,
    ratings: {
      vdg: 25,
      vgsMax: 25,
      idMax: 0.03,
      igMax: 0.01,
      ptot: 0.35,
      idss: { min: 8e-3, max: 0.02 },
      vgsOff: { min: -6, max: -2 },
      source: "2N5486 datasheet: IDSS 8\u201320 mA, VGS(off) \u22122 to \u22126 V, V(BR)GSS \u221225 V, VDG 25 V, ID 30 mA, IG(f) 10 mA, PD 350 mW [DOC, reference-data \xA74.2]"
    }
  },
  {
    name: "2N7000",
    aliases: ["2N7000BU", "2N7000TA", "2N7000G"],
    kind: "nmos",
    model: M2N7000,
    ratings: {
      vds: 60,
      vdg: 60,
      vgsMax: 20,
      vgsMaxPulse: 40,
      idMax: 0.2,
      ptot: 0.4,
      vgsTh: { min: 0.8, typ: 2.1, max: 3 },
      gateProtection: false,
      source: "2N7000 datasheet: VDSS 60 V, VDGR 60 V, VGSS \xB120 V (\xB140 V non-repetitive, tp \u2264 50 \xB5s), ID 200 mA, PD 400 mW (350 mW in an older datasheet), VGS(th) 0.8/2.1/3.0 V, no gate protection diode [DOC, reference-data \xA74.3]"
    }
  },
  {
    name: "BF998",
    aliases: ["BF998R", "BF998W", "BF998RW"],
    kind: "dual-gate-mosfet",
    model: DUAL_GATE_CHANNEL,
    gate2Model: DUAL_GATE_CHANNEL_G2,
    gateProtectionDiode: DUAL_GATE_PROTECTION,
    ratings: {
      vds: 12,
      idMax: 0.03,
      igMax: 0.01,
      ptot: 0.2,
      idss: { min: 2e-3, max: 0.018 },
      vgsOff: { min: -2.5, typ: -0.8 },
      vgsBreakdown: { min: 8, max: 12 },
      gateProtection: true,
      source: "BF998 datasheets (two agree): VDS 12 V, ID 30 mA, gate peak current \xB110 mA, Ptot 200 mW, IDSS 2\u201318 mA, \u2212VG1S(p) \u2264 2.5 V (0.8 typ), V(BR)G1SS/G2SS \xB18 to \xB112 V, integrated back-to-back gate protection diodes [DOC, reference-data \xA74.4]"
    }
  },
  {
    name: "BF992",
    aliases: [],
    kind: "dual-gate-mosfet",
    model: BF992_CHANNEL,
    gate2Model: BF992_CHANNEL_G2,
    gateProtectionDiode: DUAL_GATE_PROTECTION,
    ratings: {
      vds: 20,
      idMax: 0.04,
      ptot: 0.2,
      gateProtection: true,
      source: "BF992 datasheet: VDS 20 V, ID 40 mA, Ptot 200 mW, same protection-diode construction as the BF998 [DOC, reference-data \xA74.4]"
    }
  },
  {
    name: "1N4148",
    aliases: ["1N914", "1N4448", "LL4148", "D1N4148", "1N914B", "1N4148W", "1N4148WS", "1N4148WT"],
    kind: "diode",
    model: D1N4148,
    ratings: {
      vrrm: 100,
      ifMax: 0.2,
      ptot: 0.5,
      source: "VRRM 100 V from the vendor model file's header [DOC]; IF(AV) 200 mA and Ptot 500 mW from memory of the datasheets [MEM]"
    }
  }
];
var ZENER_1N47 = [
  3.3,
  3.6,
  3.9,
  4.3,
  4.7,
  5.1,
  5.6,
  6.2,
  6.8,
  7.5,
  8.2,
  9.1,
  10,
  11,
  12,
  13,
  15,
  16,
  18,
  20,
  22,
  24,
  27,
  30,
  33,
  36,
  39,
  43,
  47,
  51,
  56,
  62,
  68,
  75,
  82,
  91,
  100
];
function zenerVoltageFromName(name) {
  const n = name.trim().toUpperCase();
  const series2 = /^1N47(\d\d)/.exec(n);
  if (series2) {
    const v = ZENER_1N47[Number(series2[1]) - 28];
    return v;
  }
  const code = /(?:^|[A-Z-])(\d{1,3})V(\d{1,2})?(?!\d)/.exec(n.replace(/^(BZX|BZT|BZV|BZD)\d+/, ""));
  if (code) return Number(`${code[1]}.${code[2] ?? "0"}`);
  const plain = /(\d+(?:[.,]\d+)?)\s*V\b/.exec(n);
  if (plain && /ZENER|^\d/.test(n)) return Number((plain[1] ?? "").replace(",", "."));
  const trailing = /^(BZX|BZT|BZV|BZD)\d*-?[A-F](\d{1,3})$/.exec(n);
  if (trailing) return Number(trailing[2]);
  return void 0;
}
var GENERIC_ZENER_TEST_CURRENT = 5e-3;
var GENERIC_ZENER_RS = 5;
function genericZenerCard(volts, basis) {
  const bv = volts - GENERIC_ZENER_TEST_CURRENT * GENERIC_ZENER_RS;
  return {
    name: `ZENER_${volts}V`,
    type: "D",
    params: { IS: 1e-14, N: 1, RS: GENERIC_ZENER_RS, BV: bv, IBV: GENERIC_ZENER_TEST_CURRENT, CJO: 5e-11 },
    source: `ESTIMATE: generic zener card by voltage, VZ ${volts} V read from ${basis}, reached at IZT = IBV 5 mA [MEM: the small glass zeners' test current] with BV = VZ \u2212 IBV\xB7RS = ${volts} V \u2212 5 mA \xD7 5 \u03A9 = ${Number(bv.toPrecision(6))} V; knee and slope a common-practice default [CP], not the part's: breakdown current falls e-fold per N\xB7VT = 25.9 mV below IZT (5 mA \u2192 0.5 mA in 60 mV, sharper than a real zener below about 6 V), dynamic resistance RS + N\xB7VT/IZT = 5 \u03A9 + 5.2 \u03A9 \u2248 10 \u03A9 at IZT (datasheets give 5\u2013100 \u03A9); IS 10 fA, N 1, CJO 50 pF generic`
  };
}
function zenerPart(volts, name) {
  const oneWatt = /^1N47/i.test(name.trim());
  return {
    name,
    aliases: [],
    kind: "zener",
    model: genericZenerCard(volts, `the part name '${name}'`),
    ratings: {
      vz: volts,
      ptot: oneWatt ? 1 : 0.5,
      source: oneWatt ? "1N47xx series: 1 W [MEM]" : "small glass zener (BZX55/BZX79 class): 500 mW [MEM]"
    }
  };
}
function zenerVoltageFromValue(value) {
  const t = value.trim().toUpperCase();
  const rkm = /(?:^|[\s_-])(\d{1,3})V(\d{1,2})(?=$|[\s_/,])/.exec(t);
  if (rkm) return Number(`${rkm[1]}.${rkm[2]}`);
  const plain = /(?:^|[\s_-])(\d{1,3}(?:[.,]\d{1,2})?)\s?V(?=$|[\s_/,])/.exec(t);
  if (plain) return Number((plain[1] ?? "").replace(",", "."));
  return zenerVoltageFromName(t);
}
function zenerFromValue(value) {
  const volts = zenerVoltageFromValue(value);
  if (volts === void 0 || !(volts > 0) || !Number.isFinite(volts)) return void 0;
  return {
    name: value.trim(),
    aliases: [],
    kind: "zener",
    model: genericZenerCard(volts, `the Value '${value.trim()}'`),
    ratings: { vz: volts, source: `zener voltage from the Value '${value.trim()}'; dissipation unknown (no part number)` }
  };
}
var BY_NAME = /* @__PURE__ */ new Map();
for (const p of PARTS) {
  for (const n of [p.name, ...p.aliases]) BY_NAME.set(n.toUpperCase(), p);
}
var PACKAGING_SUFFIX = /^(?:-[A-Z0-9]+|BU|TA|TAR|TF|TFR|G|RLRA|RLRAG|RLRM|TR|T\/R|LT1|LT1G)$/;
function findModel(name) {
  const n = name.trim().toUpperCase();
  if (n === "") return void 0;
  const exact = BY_NAME.get(n) ?? BY_NAME.get(n.replace(/^[QDJM](?=\d)/, ""));
  if (exact) return exact;
  for (const [key, part] of BY_NAME) {
    if (n.startsWith(key) && PACKAGING_SUFFIX.test(n.slice(key.length))) return part;
  }
  if (/^(BZX|BZT|BZV|BZD|ZPD|ZMM|ZMY|TZMC|1N47[2-6]\d|ZENER|\d+V\d+$)/.test(n)) {
    const v = zenerVoltageFromName(n);
    if (v !== void 0 && v > 0) return zenerPart(v, name.trim());
  }
  return void 0;
}

// src/solve/subckt-expand.ts
var MAX_SUBCKT_DEPTH = 8;
var MAX_SUBCKT_ELEMENTS = 5e3;
var ZERO_OHMS_AS = 1e-3;
var MODEL_TYPES = {
  D: ["D"],
  Q: ["NPN", "PNP"],
  J: ["NJF", "PJF"],
  M: ["NMOS", "PMOS"]
};
var Expander = class {
  constructor(library) {
    this.library = library;
  }
  library;
  elements = [];
  notes = [];
  /** Expands `def` with its pins on `pinNodes`; a string is the problem that stopped it. */
  expand(def, pinNodes, prefix, stack) {
    const where4 = `${def.source}, subcircuit ${def.name}`;
    const first = def.problems[0];
    if (first) return `${def.source}, line ${first.line}: ${first.message}`;
    if (stack.length >= MAX_SUBCKT_DEPTH) return `${where4}: subcircuits nested deeper than ${MAX_SUBCKT_DEPTH} levels (${[...stack, def.name].join(" \u2192 ")})`;
    if (stack.some((n) => n.toUpperCase() === def.name.toUpperCase())) return `${where4} contains itself (${[...stack, def.name].join(" \u2192 ")})`;
    for (const ig of def.ignored) this.notes.push(`${def.source}, line ${ig.line}: ${ig.message}`);
    const node = (n) => {
      if (n === "0" || n === "GND") return "0";
      return pinNodes.get(n) ?? `${prefix}:${n}`;
    };
    for (const st of def.statements) {
      if (this.elements.length >= MAX_SUBCKT_ELEMENTS) return `${where4}: more than ${MAX_SUBCKT_ELEMENTS} elements once expanded`;
      const problem2 = this.add(st, def, node, prefix, [...stack, def.name]);
      if (problem2 !== void 0) return problem2;
    }
    return void 0;
  }
  model(st, def) {
    const want = st.model.toUpperCase();
    const card = def.models.find((m) => m.name.toUpperCase() === want) ?? this.library.models.find((m) => m.name.toUpperCase() === want);
    if (!card) return `${def.source}, line ${st.line}: ${st.name} uses model ${st.model}, which is neither in subcircuit ${def.name} nor at the top level of the library (or could not be read: see the notes on that library)`;
    const fits = MODEL_TYPES[st.kind];
    if (!fits.includes(card.type)) return `${def.source}, line ${st.line}: ${st.name} is a ${st.kind} element but model ${card.name} is type ${card.type}`;
    return card;
  }
  add(st, def, node, prefix, stack) {
    const name = `${prefix}:${st.name}`;
    switch (st.kind) {
      case "R": {
        const [a, b] = st.nodes;
        let ohms = st.value;
        if (ohms === 0) {
          ohms = ZERO_OHMS_AS;
          this.notes.push(`${def.source}, line ${st.line}: ${st.name} of 0 \u03A9 simulated as 1 m\u03A9`);
        }
        this.elements.push({ kind: "R", name, a: node(a), b: node(b), ohms });
        return void 0;
      }
      case "C":
        this.elements.push({ kind: "C", name, a: node(st.nodes[0]), b: node(st.nodes[1]), farads: st.value });
        return void 0;
      case "L":
        this.elements.push({ kind: "L", name, a: node(st.nodes[0]), b: node(st.nodes[1]), henries: st.value });
        return void 0;
      case "V":
      case "I": {
        const ac = st.ac !== void 0 ? { ac: st.ac } : {};
        this.elements.push({ kind: st.kind, name, pos: node(st.nodes[0]), neg: node(st.nodes[1]), dc: st.dc, ...ac });
        return void 0;
      }
      case "D":
      case "Q":
      case "J":
      case "M": {
        const model = this.model(st, def);
        if (typeof model === "string") return model;
        const n = st.nodes.map(node);
        const at = (i) => n[i] ?? "0";
        const area = st.area !== void 0 ? { area: st.area } : {};
        if (st.kind === "D") this.elements.push({ kind: "D", name, anode: at(0), cathode: at(1), model, ...area });
        else if (st.kind === "Q") this.elements.push({ kind: "Q", name, c: at(0), b: at(1), e: at(2), model, ...area });
        else if (st.kind === "J") this.elements.push({ kind: "J", name, d: at(0), g: at(1), s: at(2), model, ...area });
        else this.elements.push({ kind: "M", name, d: at(0), g: at(1), s: at(2), b: at(3), model, ...st.w !== void 0 ? { w: st.w } : {}, ...st.l !== void 0 ? { l: st.l } : {} });
        return void 0;
      }
      case "X": {
        const inner = findSubcircuit(this.library.subcircuits, st.subckt);
        if (!inner) return `${def.source}, line ${st.line}: ${st.name} calls subcircuit ${st.subckt}, which is not in the library`;
        if (inner.pins.length !== st.nodes.length) {
          return `${def.source}, line ${st.line}: ${st.name} connects ${st.nodes.length} nodes but subcircuit ${inner.name} has ${inner.pins.length} pins (${inner.pins.join(" ")})`;
        }
        const pins = new Map(inner.pins.map((p, i) => [p, node(st.nodes[i] ?? "0")]));
        return this.expand(inner, pins, name, stack);
      }
    }
  }
};
function expandSubcircuit(def, pinNodes, prefix, library) {
  const missing = def.pins.filter((p) => !pinNodes.has(p));
  if (missing.length > 0) return { ok: false, problem: `subcircuit ${def.name} pin${missing.length > 1 ? "s" : ""} ${missing.join(", ")} not connected to any pin of the symbol` };
  const ex = new Expander(library);
  const problem2 = ex.expand(def, pinNodes, prefix, []);
  return problem2 === void 0 ? { ok: true, elements: ex.elements, notes: [...new Set(ex.notes)] } : { ok: false, problem: problem2 };
}

// src/solve/from-circuit.ts
var DEFAULT_INDUCTOR_DCR = 0.1;
var ZERO_OHM_LINK = 1e-3;
function field2(part, name) {
  const want = name.toLowerCase();
  for (const [k, v] of Object.entries(part.fields)) {
    if (k.toLowerCase() === want && v.trim() !== "" && v.trim() !== "~") return v.trim();
  }
  return void 0;
}
function symbolName(libId) {
  const i = libId.indexOf(":");
  return i < 0 ? libId : libId.slice(i + 1);
}
var railVoltsFromName = voltsFromNetName;
function isExcluded(part) {
  if (part.dnp || part.excludedFromSim) return true;
  const enable = field2(part, "Sim.Enable");
  if (enable !== void 0 && /^(0|n|no|false)$/i.test(enable)) return true;
  const spice = field2(part, "Spice_Netlist_Enabled");
  return spice !== void 0 && /^(0|n|no|false)$/i.test(spice);
}
function numericParams(text) {
  const params = {};
  const unread = [];
  for (const [k, raw] of Object.entries(parseSimParams(text))) {
    const v = parseSpiceNumber(raw);
    if (v === void 0) unread.push(`${k}=${raw}`);
    else params[k.toUpperCase()] = v;
  }
  return { params, unread };
}
var SIM_DEVICE_TYPE = {
  D: "D",
  NPN: "NPN",
  PNP: "PNP",
  NJFET: "NJF",
  PJFET: "PJF",
  NMOS: "NMOS",
  PMOS: "PMOS"
};
var SUPPORTED_SIM_TYPES = /* @__PURE__ */ new Set(["", "GUMMELPOON", "GP", "SHICHMANHODGES", "MOS1", "LEVEL1"]);
var INSTANCE_PARAMS = /* @__PURE__ */ new Set(["AREA", "M", "W", "L", "TEMP", "DTEMP", "OFF", "IC"]);
var WANTED_TYPES = {
  diode: ["D"],
  zener: ["D"],
  npn: ["NPN"],
  pnp: ["PNP"],
  njfet: ["NJF"],
  pjfet: ["PJF"],
  nmos: ["NMOS"],
  pmos: ["PMOS"],
  "dual-gate-mosfet": ["NMOS"]
};
var PRINCIPAL_ELEMENT = {
  diode: "D",
  zener: "D",
  npn: "Q",
  pnp: "Q",
  njfet: "J",
  pjfet: "J",
  nmos: "M",
  pmos: "M"
};
function libraryModels(ctx, path) {
  if (ctx.libraries.has(path)) return ctx.libraries.get(path);
  const lib = ctx.circuit.modelLibraries.find((l) => l.path.trim() === path.trim());
  const parsed = lib ? parseModelCards(lib.text, `model library '${lib.path}'`) : void 0;
  if (parsed) for (const n of parsed.notes) ctx.notes.push({ message: `model library '${path}', line ${n.line}: ${n.message}` });
  ctx.libraries.set(path, parsed);
  return parsed;
}
function typeFits(card, want, part, ctx, where4) {
  if (want.includes(card.type)) return true;
  ctx.notes.push({ ref: part.ref, message: `${part.ref}: model ${card.name} (${where4}) is type ${card.type}, but the symbol is a ${part.kind}; not used` });
  return false;
}
function overridesOf(part, ctx) {
  const text = field2(part, "Sim.Params");
  if (!text) return {};
  const { params, unread } = numericParams(text);
  for (const k of Object.keys(params)) if (INSTANCE_PARAMS.has(k)) delete params[k];
  if (unread.length > 0) ctx.notes.push({ ref: part.ref, message: `${part.ref}: Sim.Params entries not read as numbers: ${unread.join(" ")}` });
  return params;
}
function overridden(card, part, params) {
  if (Object.keys(params).length === 0) return card;
  return {
    ...card,
    params: { ...card.params, ...params },
    source: `${card.source}; overridden by Sim.Params of ${part.ref} (${Object.keys(params).join(", ")})`
  };
}
function withOverrides(card, part, ctx) {
  return overridden(card, part, overridesOf(part, ctx));
}
function cardOrSubcircuit(lib, name, part) {
  const card = findModelCard(lib.models, name);
  const subcircuit = findSubcircuit(lib.subcircuits, name);
  const wantsSubckt = field2(part, "Sim.Device")?.toUpperCase() === "SUBCKT";
  if (subcircuit && (wantsSubckt || !card)) return { subcircuit };
  return card ? { card } : {};
}
function modelNames(part) {
  const names = [];
  const spiceModel = field2(part, "Spice_Model");
  if (spiceModel && !/[\s(]/.test(spiceModel)) names.push(spiceModel);
  names.push(part.value, symbolName(part.libId));
  return [...new Set(names.map((n) => n.trim()).filter((n) => n !== "" && n !== "~"))];
}
function resolveModel(part, want, ctx) {
  const simLibrary = field2(part, "Sim.Library");
  const simDevice = field2(part, "Sim.Device")?.toUpperCase();
  const simType = (field2(part, "Sim.Type") ?? "").toUpperCase();
  const names = modelNames(part);
  const libraryPart = names.map(findModel).find((p) => p !== void 0);
  const lp = libraryPart ? { libraryPart } : {};
  if (simLibrary) {
    const lib = libraryModels(ctx, simLibrary);
    const name = field2(part, "Sim.Name") ?? part.value;
    if (!lib) {
      ctx.notes.push({ ref: part.ref, message: `${part.ref}: model library '${simLibrary}' was not read; looking for ${name} elsewhere` });
    } else {
      const { card, subcircuit } = cardOrSubcircuit(lib, name, part);
      if (subcircuit) return { subcircuit, library: lib, where: `'${simLibrary}'`, ...lp };
      if (!card) ctx.notes.push({ ref: part.ref, message: `${part.ref}: neither a .model nor a .subckt ${name} in '${simLibrary}'; looking elsewhere` });
      else if (typeFits(card, want, part, ctx, `'${simLibrary}'`)) return { card: withOverrides(card, part, ctx), ...lp };
    }
  } else if (simDevice && SIM_DEVICE_TYPE[simDevice]) {
    const type = SIM_DEVICE_TYPE[simDevice];
    const text = field2(part, "Sim.Params");
    if (!SUPPORTED_SIM_TYPES.has(simType)) {
      ctx.notes.push({ ref: part.ref, message: `${part.ref}: Sim.Type ${simType} is not supported (Gummel\u2013Poon, Shichman\u2013Hodges and MOS level 1 are); looking for another model` });
    } else if (type && text) {
      const { params, unread } = numericParams(text);
      for (const k of Object.keys(params)) if (INSTANCE_PARAMS.has(k)) delete params[k];
      if (unread.length > 0) ctx.notes.push({ ref: part.ref, message: `${part.ref}: Sim.Params entries not read as numbers: ${unread.join(" ")}` });
      if ((type === "NMOS" || type === "PMOS") && params.LEVEL !== void 0 && params.LEVEL !== 1) {
        ctx.notes.push({ ref: part.ref, message: `${part.ref}: Sim.Params LEVEL=${params.LEVEL}: only level-1 MOSFETs are supported; looking for another model` });
      } else {
        const card = { name: `${part.ref}_model`, type, params, source: `Sim.Params of ${part.ref} (unlisted parameters at SPICE defaults)` };
        if (typeFits(card, want, part, ctx, "Sim.Device")) return { card, ...lp };
      }
    }
  }
  const spiceLib = field2(part, "Spice_Lib_File");
  const spiceModel = field2(part, "Spice_Model");
  if (spiceLib && spiceModel) {
    const lib = libraryModels(ctx, spiceLib);
    const { card, subcircuit } = lib ? cardOrSubcircuit(lib, spiceModel, part) : {};
    if (!lib) ctx.notes.push({ ref: part.ref, message: `${part.ref}: model library '${spiceLib}' was not read; looking for ${spiceModel} elsewhere` });
    else if (subcircuit) return { subcircuit, library: lib, where: `'${spiceLib}'`, ...lp };
    else if (!card) ctx.notes.push({ ref: part.ref, message: `${part.ref}: neither a .model nor a .subckt ${spiceModel} in '${spiceLib}'; looking elsewhere` });
    else if (typeFits(card, want, part, ctx, `'${spiceLib}'`)) return { card: withOverrides(card, part, ctx), ...lp };
  }
  if (ctx.config) {
    for (const name of names) {
      const { card, subcircuit } = cardOrSubcircuit(ctx.config, name, part);
      if (subcircuit) return { subcircuit, library: ctx.config, where: "config models", ...lp };
      if (card && typeFits(card, want, part, ctx, "config models")) return { card: withOverrides(card, part, ctx), ...lp };
    }
  }
  for (const name of names) {
    const found = findModel(name);
    if (found && typeFits(found.model, want, part, ctx, "built-in library")) {
      const params = overridesOf(part, ctx);
      const gate2 = found.gate2Model ? { gate2Card: overridden(found.gate2Model, part, params) } : {};
      return { card: overridden(found.model, part, params), ...gate2, libraryPart: found };
    }
  }
  if (part.kind === "zener") {
    const generic = zenerFromValue(part.value);
    if (generic) return { card: withOverrides(generic.model, part, ctx), libraryPart: generic };
  }
  return void 0;
}
function ratingsFromCard(card) {
  const p = card.params;
  const r = { source: `rating parameters of model ${card.name} (${card.source})` };
  if (p.VCEO !== void 0) r.vceo = Math.abs(p.VCEO);
  if (p.ICRATING !== void 0) r.icMax = Math.abs(p.ICRATING);
  if (p.VDS !== void 0) r.vds = Math.abs(p.VDS);
  if (p.VPK !== void 0) r.vrrm = Math.abs(p.VPK);
  if (p.IAVE !== void 0) r.ifMax = Math.abs(p.IAVE);
  return Object.keys(r).length > 1 ? r : void 0;
}
var Builder = class {
  constructor(circuit, opts) {
    this.circuit = circuit;
    this.opts = opts;
    const groundNames = new Set((opts.groundNames ?? []).map((n) => n.toLowerCase()));
    for (const net of circuit.nets) {
      const ground = net.isGround || net.name === "0" || [net.name, localNetName(net.name), ...net.aliases].some((a) => groundNames.has(a.toLowerCase()));
      this.nodeOfNet[net.name] = ground ? "0" : net.name;
    }
    this.ctx = { circuit, notes: this.notes, libraries: /* @__PURE__ */ new Map() };
    if (opts.modelsText !== void 0 && opts.modelsText.trim() !== "") {
      const parsed = parseModelCards(opts.modelsText, "config models");
      for (const n of parsed.notes) this.notes.push({ message: `config models, line ${n.line}: ${n.message}` });
      this.ctx.config = parsed;
    }
  }
  circuit;
  opts;
  elements = [];
  notes = [];
  unmodelled = [];
  ratings = {};
  nodeOfNet = {};
  /** Nets driven by a source part that is simulated (no ideal rail is added on them). */
  sourceDriven = /* @__PURE__ */ new Map();
  ctx;
  skip(part, why) {
    if (!this.unmodelled.includes(part.ref)) this.unmodelled.push(part.ref);
    this.notes.push({ ref: part.ref, message: `${part.ref} is not simulated: ${why}` });
  }
  note(part, message) {
    this.notes.push({ ref: part.ref, message: `${part.ref}: ${message}` });
  }
  /** The node on a role's pin; an unconnected pin gets a node of its own (and a note). */
  node(part, role) {
    const pin = part.roles[role] ?? "";
    const net = part.pins[pin];
    if (net === void 0) {
      this.note(part, `pin ${pin} (${role}) is not connected`);
      return `${part.ref}#pin${pin}`;
    }
    return this.nodeOfNet[net] ?? net;
  }
  rolesMissing(part) {
    return REQUIRED_ROLES[part.kind].filter((r) => part.roles[r] === void 0);
  }
  /** A value from Sim.Params (`r=10k`) when Sim.Device names the element, else the parsed Value. */
  passiveValue(part, device) {
    const simDevice = field2(part, "Sim.Device")?.toUpperCase();
    const params = field2(part, "Sim.Params");
    if (simDevice === device && params) {
      const raw = parseSimParams(params)[device.toLowerCase()];
      const v = raw !== void 0 ? parseSpiceNumber(raw) : void 0;
      if (v !== void 0) return v;
    }
    return part.parsed.number;
  }
  add(part) {
    const missing = this.rolesMissing(part);
    if (missing.length > 0) {
      const named = Object.entries(part.pinNames).map(([n, name]) => `${n}=${name || "unnamed"}`).join(", ");
      this.skip(part, `cannot tell which pin is ${missing.join(", ")} (pins ${named || "unknown"})`);
      return;
    }
    switch (part.kind) {
      case "resistor":
        return this.addResistor(part);
      case "capacitor":
      case "polarized-capacitor":
        return this.addCapacitor(part);
      case "inductor":
        return this.addInductor(part);
      case "battery":
        return this.addBattery(part);
      case "voltage-source":
      case "current-source":
        return this.addSource(part);
      case "diode":
      case "zener":
      case "npn":
      case "pnp":
      case "njfet":
      case "pjfet":
      case "nmos":
      case "pmos":
      case "dual-gate-mosfet":
        return this.addDevice(part);
      case "connector":
      case "power-flag":
        return;
      case "other":
        this.skip(part, `no model for a '${part.value || symbolName(part.libId)}' (${part.libId || "no library id"}); only passives, diodes, BJTs, JFETs, MOSFETs and sources are simulated`);
        return;
    }
  }
  addResistor(part) {
    const ohms = this.passiveValue(part, "R");
    if (ohms === void 0) return this.skip(part, part.parsed.problem ?? `no resistance in '${part.value}'`);
    let value = ohms;
    if (ohms === 0) {
      value = ZERO_OHM_LINK;
      this.note(part, "zero-ohm link simulated as 1 m\u03A9");
    }
    this.elements.push({ kind: "R", name: part.ref, a: this.node(part, "1"), b: this.node(part, "2"), ohms: value });
  }
  addCapacitor(part) {
    const farads = this.passiveValue(part, "C");
    if (farads === void 0 || !(farads > 0)) return this.skip(part, part.parsed.problem ?? `no capacitance in '${part.value}'`);
    const sized = farads === part.parsed.number ? part : { ...part, parsed: { ...part.parsed, number: farads } };
    const { esr, esl } = estimateCapacitorParasitics(sized);
    const [a, b] = part.kind === "polarized-capacitor" ? ["+", "-"] : ["1", "2"];
    this.elements.push({ kind: "C", name: part.ref, a: this.node(part, a ?? "1"), b: this.node(part, b ?? "2"), farads, esr, esl });
  }
  addInductor(part) {
    const henries = this.passiveValue(part, "L");
    if (henries === void 0 || !(henries > 0)) return this.skip(part, part.parsed.problem ?? `no inductance in '${part.value}'`);
    let series2 = DEFAULT_INDUCTOR_DCR;
    const written = field2(part, "DCR") ?? field2(part, "Rdc") ?? field2(part, "R") ?? field2(part, "ESR");
    const read = written !== void 0 ? parseQuantity(written, "\u03A9") : void 0;
    if (typeof read === "number") series2 = read;
    else {
      const why = read ? ` (field '${written}' not read: ${read.error})` : "";
      this.note(part, `winding resistance unknown${why}; ${formatQuantity(DEFAULT_INDUCTOR_DCR, "\u03A9")} assumed, add a DCR field with the datasheet figure`);
    }
    this.elements.push({ kind: "L", name: part.ref, a: this.node(part, "1"), b: this.node(part, "2"), henries, series: series2 });
  }
  addBattery(part) {
    const spec = this.sourceSpec(part);
    const volts = spec?.dc;
    if (volts === void 0) return this.skip(part, part.parsed.problem ?? `no voltage in '${part.value}'`);
    let series2;
    const written = field2(part, "R_internal") ?? field2(part, "Rint") ?? field2(part, "ESR") ?? field2(part, "R_int");
    const read = written !== void 0 ? parseQuantity(written, "\u03A9") : void 0;
    if (typeof read === "number") series2 = read;
    else {
      const assumed = defaultBatteryResistance(part, volts);
      series2 = assumed.ohms;
      this.note(part, `internal resistance ${formatQuantity(assumed.ohms, "\u03A9")} assumed (${assumed.basis}); give an R_internal field to use your cell's figure`);
    }
    const pos = this.node(part, "+");
    const neg = this.node(part, "-");
    this.elements.push({ kind: "V", name: part.ref, pos, neg, dc: volts, series: series2 });
    this.sourceDriven.set(pos, part.ref);
    this.sourceDriven.set(neg, part.ref);
  }
  /** DC and AC of a source from Sim.Params, Spice_Model or the Value, in that order. */
  sourceSpec(part) {
    const simParams = field2(part, "Sim.Params");
    if (simParams) {
      const p = parseSimParams(simParams);
      const dc = p.dc !== void 0 ? parseSpiceNumber(p.dc) : void 0;
      const ac = p.ac !== void 0 ? parseSpiceNumber(p.ac) : void 0;
      if (dc !== void 0 || ac !== void 0) return { ...dc !== void 0 ? { dc } : {}, ...ac !== void 0 ? { ac } : {} };
    }
    const spiceModel = field2(part, "Spice_Model");
    if (spiceModel) {
      const s = parseSourceSpec(spiceModel);
      if (!("error" in s)) return s;
    }
    if (part.parsed.number !== void 0) return { dc: part.parsed.number };
    const fromValue = parseSourceSpec(part.value);
    return "error" in fromValue ? void 0 : fromValue;
  }
  addSource(part) {
    const spec = this.sourceSpec(part);
    if (spec === void 0 || spec.dc === void 0 && spec.ac === void 0) {
      return this.skip(part, `no DC or AC value found (Value '${part.value}', no dc= in Sim.Params)`);
    }
    const dc = spec.dc ?? 0;
    const pos = this.node(part, "+");
    const neg = this.node(part, "-");
    const ac = spec.ac !== void 0 ? { ac: spec.ac } : {};
    if (part.kind === "voltage-source") {
      this.elements.push({ kind: "V", name: part.ref, pos, neg, dc, ...ac });
      this.sourceDriven.set(pos, part.ref);
      this.sourceDriven.set(neg, part.ref);
    } else this.elements.push({ kind: "I", name: part.ref, pos, neg, dc, ...ac });
  }
  addDevice(part) {
    const want = WANTED_TYPES[part.kind] ?? [];
    const choice = resolveModel(part, want, this.ctx);
    const lp = choice?.libraryPart ?? modelNames(part).map(findModel).find((p) => p !== void 0);
    const rating = lp?.ratings ?? (choice && "card" in choice ? ratingsFromCard(choice.card) : void 0);
    if (rating) this.ratings[part.ref] = rating;
    if (!choice) {
      const tried = modelNames(part).join("', '");
      const zenerHint = part.kind === "zener" ? " (or write the zener voltage in its Value, e.g. 5V6)" : "";
      return this.skip(part, `no model found for '${tried}' (Sim.* fields, model libraries, the config's models and the built-in library were searched); add a .model card under "models" in the config${zenerHint}`);
    }
    if ("subcircuit" in choice) return this.addSubcircuit(part, choice);
    const model = choice.card;
    if (part.kind === "zener" && model.params.BV === void 0) this.note(part, `zener model ${model.name} has no BV; it will not break down`);
    switch (part.kind) {
      case "diode":
      case "zener":
        this.elements.push({ kind: "D", name: part.ref, anode: this.node(part, "A"), cathode: this.node(part, "K"), model });
        return;
      case "npn":
      case "pnp":
        this.elements.push({ kind: "Q", name: part.ref, c: this.node(part, "C"), b: this.node(part, "B"), e: this.node(part, "E"), model });
        return;
      case "njfet":
      case "pjfet":
        this.elements.push({ kind: "J", name: part.ref, d: this.node(part, "D"), g: this.node(part, "G"), s: this.node(part, "S"), model });
        return;
      case "nmos":
      case "pmos": {
        const s = this.node(part, "S");
        const b = part.roles.B !== void 0 ? this.node(part, "B") : s;
        this.elements.push({ kind: "M", name: part.ref, d: this.node(part, "D"), g: this.node(part, "G"), s, b, model });
        return;
      }
      case "dual-gate-mosfet":
        this.addDualGate(part, model, choice.gate2Card ?? model, lp?.gateProtectionDiode);
        return;
      default:
        return;
    }
  }
  /** A tetrode as two channels in series through an internal node (G1 channel at the source, G2 channel
   * at the drain, substrate on the source), plus back-to-back gate–source diodes when protected. */
  addDualGate(part, model, gate2Model, protection) {
    const d = this.node(part, "D");
    const s = this.node(part, "S");
    const g1 = this.node(part, "G1");
    const g2 = this.node(part, "G2");
    const mid = `${part.ref}#mid`;
    this.elements.push({ kind: "M", name: `${part.ref}.g1`, d: mid, g: g1, s, b: s, model });
    this.elements.push({ kind: "M", name: `${part.ref}.g2`, d, g: g2, s: mid, b: s, model: gate2Model });
    if (!protection) return;
    for (const [label, gate] of [["g1", g1], ["g2", g2]]) {
      const k = `${part.ref}#${label}prot`;
      this.elements.push({ kind: "D", name: `${part.ref}.${label}a`, anode: gate, cathode: k, model: protection });
      this.elements.push({ kind: "D", name: `${part.ref}.${label}b`, anode: s, cathode: k, model: protection });
    }
  }
  /** Subcircuit pin → node: by Sim.Pins (`1=S 2=D 3=G2 4=G1`, symbol pin = subcircuit pin), by KiCad 6's
   * Spice_Node_Sequence (symbol pins in the subcircuit's pin order), else by position in pin-number
   * order. A string is the reason it cannot be done. */
  subcircuitPins(part, def) {
    const symbolPins = [.../* @__PURE__ */ new Set([...Object.keys(part.pins), ...Object.keys(part.pinNames)])].sort(naturalCompare);
    const nodeOfPin = (pin) => {
      const net = part.pins[pin];
      if (net === void 0) {
        this.note(part, `pin ${pin} is not connected`);
        return `${part.ref}#pin${pin}`;
      }
      return this.nodeOfNet[net] ?? net;
    };
    const pinNodes = /* @__PURE__ */ new Map();
    const simPins = field2(part, "Sim.Pins");
    if (simPins) {
      const pairs = parseSimPins(simPins);
      for (const [pin, subPin] of Object.entries(pairs)) {
        const want = subPin.toUpperCase();
        if (!symbolPins.includes(pin)) return `Sim.Pins '${simPins}' names pin ${pin}, which the symbol does not have (pins ${symbolPins.join(", ")})`;
        if (!def.pins.includes(want)) return `Sim.Pins '${simPins}' maps pin ${pin} to ${subPin}, which is not a pin of subcircuit ${def.name} (${def.pins.join(" ")})`;
        if (pinNodes.has(want)) return `Sim.Pins '${simPins}' maps two symbol pins to subcircuit pin ${subPin}`;
        pinNodes.set(want, nodeOfPin(pin));
      }
      const open = symbolPins.filter((p) => !(p in pairs));
      if (open.length > 0) this.note(part, `symbol pin${open.length > 1 ? "s" : ""} ${open.join(", ")} not in Sim.Pins: left out of the subcircuit`);
      return pinNodes;
    }
    const sequence = field2(part, "Spice_Node_Sequence")?.split(/[\s,]+/).filter((p) => p !== "");
    const order = sequence ?? symbolPins;
    const how = sequence ? `Spice_Node_Sequence '${sequence.join(" ")}' lists` : "the symbol has";
    if (order.length !== def.pins.length) {
      return `${how} ${order.length} pins and subcircuit ${def.name} has ${def.pins.length} (${def.pins.join(" ")}); give a Sim.Pins field (e.g. "${def.pins.map((p, i) => `${symbolPins[i] ?? i + 1}=${p}`).join(" ")}")`;
    }
    const unknown = order.find((p) => !symbolPins.includes(p));
    if (unknown !== void 0) return `${how} pin ${unknown}, which the symbol does not have (pins ${symbolPins.join(", ")})`;
    def.pins.forEach((p, i) => pinNodes.set(p, nodeOfPin(order[i] ?? "")));
    return pinNodes;
  }
  /** A part modelled by a subcircuit: its expansion, with the part's own device(s) named as the Context
   * expects. */
  addSubcircuit(part, choice) {
    const def = choice.subcircuit;
    const pins = this.subcircuitPins(part, def);
    if (typeof pins === "string") return this.skip(part, `subcircuit ${def.name} from ${choice.where}: ${pins}`);
    const expansion = expandSubcircuit(def, pins, part.ref, choice.library);
    if (!expansion.ok) return this.skip(part, `subcircuit ${def.name} from ${choice.where} cannot be used: ${expansion.problem}`);
    const elements = expansion.elements;
    for (const n of expansion.notes) this.note(part, n);
    const params = field2(part, "Sim.Params");
    if (params) this.note(part, `Sim.Params '${params}' not passed to subcircuit ${def.name}: subcircuit parameters are not supported`);
    const named = part.kind === "dual-gate-mosfet" ? this.nameChannels(part, elements) : this.namePrincipal(part, elements);
    if (named === void 0) return;
    this.note(part, `modelled by subcircuit ${def.name} from ${choice.where} (line ${def.line}), ${elements.length} elements${named}`);
    this.elements.push(...elements);
  }
  /** The one D/Q/J/M inside that is the part gets the part's reference. Returns text for the note, or
   * undefined when the part was skipped (its device has the wrong polarity). */
  namePrincipal(part, elements) {
    const kind = PRINCIPAL_ELEMENT[part.kind];
    if (kind === void 0) return "";
    const found = elements.filter((e) => e.kind === kind);
    const [only] = found;
    if (found.length !== 1 || only === void 0) {
      return `; ${found.length === 0 ? "no" : `${found.length}`} ${kind} elements inside, so ${part.ref}'s own operating point is not reported`;
    }
    const want = WANTED_TYPES[part.kind] ?? [];
    if ((only.kind === "D" || only.kind === "Q" || only.kind === "J" || only.kind === "M") && !want.includes(only.model.type)) {
      this.skip(part, `the ${kind} element ${only.name} in its subcircuit uses model ${only.model.name} of type ${only.model.type}, but the symbol is a ${part.kind}`);
      return void 0;
    }
    const inside = only.name;
    only.name = part.ref;
    return `; ${inside} is ${part.ref}'s own device`;
  }
  /** A dual-gate's channels: the MOSFET whose gate is on the G1 pin's node is `REF.g1`, on G2 `REF.g2`;
   * failing that (gates behind resistors), of exactly two MOSFETs in series the one at the source. */
  nameChannels(part, elements) {
    const mosfets = elements.filter((e) => e.kind === "M");
    const g1Node = this.node(part, "G1");
    const g2Node = this.node(part, "G2");
    let g1 = mosfets.filter((m) => m.g === g1Node);
    let g2 = mosfets.filter((m) => m.g === g2Node);
    if (!(g1.length === 1 && g2.length === 1) && mosfets.length === 2) {
      const [a, b] = mosfets;
      if (a.d === b.s) [g1, g2] = [[a], [b]];
      else if (b.d === a.s) [g1, g2] = [[b], [a]];
    }
    const [lower] = g1;
    const [upper] = g2;
    if (g1.length !== 1 || g2.length !== 1 || lower === void 0 || upper === void 0 || lower === upper) {
      return `; its gate-1 and gate-2 channels could not be told apart (${mosfets.length} MOSFETs inside), so their operating points are not reported`;
    }
    const names = `; ${lower.name} is the gate-1 channel (${part.ref}.g1), ${upper.name} the gate-2 channel (${part.ref}.g2)`;
    lower.name = `${part.ref}.g1`;
    upper.name = `${part.ref}.g2`;
    return names;
  }
  /** Ideal sources for rails whose voltage is known and which no simulated source part drives. */
  addRails() {
    const byAlias = new Map(Object.entries(this.opts.railVolts));
    for (const net of this.circuit.nets) {
      const node = this.nodeOfNet[net.name] ?? net.name;
      if (node === "0") continue;
      const configured = railCandidates(net).map((a) => byAlias.get(a)).find((v) => v !== void 0);
      if (!net.isPower && configured === void 0) continue;
      const volts = configured ?? railCandidates(net).map(railVoltsFromName).find((v) => v !== void 0);
      if (volts === void 0) {
        this.notes.push({ message: `power net ${net.name} has no known voltage: give it one under "rails" in the config, e.g. "rails": { "${localNetName(net.name)}": "9V" }` });
        continue;
      }
      const driver = this.sourceDriven.get(node);
      if (driver !== void 0) {
        this.notes.push({ message: `rail ${net.name} is driven by ${driver}; no ideal ${formatQuantity(volts, "V")} supply added` });
        continue;
      }
      this.elements.push({ kind: "V", name: `Vrail_${net.name}`, pos: node, neg: "0", dc: volts });
    }
  }
};
function railCandidates(net) {
  return [.../* @__PURE__ */ new Set([net.name, localNetName(net.name), ...net.aliases])];
}
function defaultBatteryResistance(part, volts) {
  const text = `${part.value} ${part.footprint} ${part.libId}`;
  if (/CR\d{4}|coin|button/i.test(text)) return { ohms: 15, basis: "typical lithium coin cell, common practice" };
  if (Math.abs(Math.abs(volts) - 9) < 0.5) return { ohms: 1.5, basis: "typical 9 V alkaline block, 1\u20132 \u03A9, common practice" };
  const cells = Math.max(1, Math.round(Math.abs(volts) / 1.5));
  return { ohms: 0.15 * cells, basis: `${cells} alkaline cell(s) at about 0.15 \u03A9 each, common practice` };
}
function buildSolverCircuit(circuit, opts) {
  const b = new Builder(circuit, opts);
  const connectors = [];
  const excluded = [];
  for (const part of circuit.parts) {
    if (part.kind === "power-flag") continue;
    if (isExcluded(part)) {
      excluded.push(part.ref);
      continue;
    }
    if (part.kind === "connector") {
      connectors.push(part.ref);
      continue;
    }
    b.add(part);
  }
  b.addRails();
  if (excluded.length > 0) b.notes.push({ message: `left out as DNP or excluded from simulation: ${excluded.join(", ")}` });
  if (connectors.length > 0) b.notes.push({ message: `connectors are left open (what plugs into them is not simulated): ${connectors.join(", ")}` });
  const title = circuit.file.slice(Math.max(circuit.file.lastIndexOf("/"), circuit.file.lastIndexOf("\\")) + 1);
  return {
    solver: { title, elements: b.elements },
    notes: b.notes,
    unmodelled: b.unmodelled,
    nodeOfNet: b.nodeOfNet,
    ratings: b.ratings
  };
}

// src/engine/context-solver.ts
function buildSolver(circuit, railVolts, modelsText) {
  const result = buildSolverCircuit(circuit, modelsText === void 0 ? { railVolts } : { railVolts, modelsText });
  const reasonOf = (ref) => {
    const note = result.notes.find((n) => n.ref === ref && /is not simulated/.test(n.message));
    return note ? note.message.replace(/^.*? is not simulated: /, "") : "not simulated";
  };
  return {
    ok: true,
    build: {
      solver: result.solver,
      notes: result.notes,
      unmodelled: result.unmodelled.map((ref) => ({ ref, reason: reasonOf(ref) })),
      nodeOfNet: result.nodeOfNet,
      ratings: result.ratings
    }
  };
}
function solveDc(solver) {
  return solveOperatingPoint(solver);
}
function toPoints(frequencies, re, im) {
  return frequencies.map((hertz, k) => {
    const r = re[k] ?? Number.NaN;
    const i = im[k] ?? Number.NaN;
    return { hertz, re: r, im: i, magnitude: Math.hypot(r, i) };
  });
}
function solvedPoints(points) {
  if (points.some((p) => !Number.isFinite(p.mag))) return void 0;
  return points.map((p) => ({ hertz: p.f, re: p.re, im: p.im, magnitude: p.mag }));
}
function impedanceAt(solver, op, node, freqs, passiveOnly) {
  return solvedPoints(impedanceToGround(solver, op, node, freqs, { passiveOnly }));
}
function impedanceBetweenAt(solver, op, a, b, freqs, passiveOnly) {
  return solvedPoints(impedanceBetween(solver, op, a, b, freqs, { passiveOnly }));
}
function transferAt(solver, op, input, output, freqs) {
  const ac = acSweep(solver, op, freqs, { kind: "current", node: input });
  const vin = ac.nodeVoltages[input];
  const vout = output === "0" ? void 0 : ac.nodeVoltages[output];
  if (ac.problem !== void 0 || !vin || !vout) return void 0;
  const re = [];
  const im = [];
  freqs.forEach((_, k) => {
    const ar = vout.re[k] ?? Number.NaN, ai = vout.im[k] ?? Number.NaN;
    const br = vin.re[k] ?? Number.NaN, bi = vin.im[k] ?? Number.NaN;
    const d = br * br + bi * bi;
    re.push((ar * br + ai * bi) / d);
    im.push((ai * br - ar * bi) / d);
  });
  return toPoints(freqs, re, im);
}
function seriesDecade(series2) {
  return E_SERIES[series2];
}
function capacitorModel(part) {
  const farads = part.parsed.number;
  if (farads === void 0 || !(farads > 0)) return void 0;
  const { esr, esl, basis } = estimateCapacitorParasitics(part);
  return { farads, esr, esl, srfHertz: selfResonantFrequency(farads, esl), source: basis };
}
function thermalVoltage() {
  return THERMAL_VOLTAGE;
}

// src/engine/context.ts
var TOPOLOGY_SHORT_OHMS = 100;
function lazy(compute) {
  let done = false;
  let value;
  return () => {
    if (!done) {
      value = compute();
      done = true;
    }
    return value;
  };
}
function naturalCompare2(a, b) {
  return a.localeCompare(b, "en", { numeric: true });
}
function createContext(circuit, config, extras = {}) {
  const band = { low: config.band.low, high: config.band.high, isDefault: config.band.isDefault };
  const index = indexCircuit(circuit);
  const groundNets = new Set(circuit.nets.filter((n) => n.isGround).map((n) => n.name));
  const railSurvey = lazy(() => surveyRails(circuit, config.rails));
  const railByNet = lazy(() => new Map(railSurvey().rails.map((r) => [r.net, r])));
  const isGround = (net) => groundNets.has(net);
  const unresolvedSet = lazy(() => new Set(railSurvey().unresolved));
  const isSupply = (net) => groundNets.has(net) || railByNet().has(net) || unresolvedSet().has(net);
  const centre = Math.sqrt(band.low * band.high);
  const acTest = {
    isSupply,
    isGround,
    minimumFarads: 1 / (2 * Math.PI * centre * TOPOLOGY_SHORT_OHMS)
  };
  const devices = lazy(() => circuit.parts.filter((p) => !p.dnp && ACTIVE_KINDS.has(p.kind)).sort((a, b) => naturalCompare2(a.ref, b.ref)));
  const stages = lazy(() => devices().map((d) => classifyStage(d, index, acTest)).filter((s) => s !== void 0));
  const stacks = lazy(() => findStacks(devices(), index, acTest));
  const railLoads = lazy(() => {
    const byRail = /* @__PURE__ */ new Map();
    for (const device of devices()) {
      const terminals = terminalsOf(device.kind);
      if (!terminals) continue;
      const net = netOfRole(device, terminals.output);
      if (net === void 0 || isSupply(net)) continue;
      const path = pathToSupply(net, index, acTest);
      const first = path?.parts[0];
      if (!path || !first) continue;
      const ohms = loadOhms(first, band.low);
      if (ohms === void 0) continue;
      const rails = /* @__PURE__ */ new Set([path.rail]);
      let cursor = net;
      for (const part of path.parts) {
        const next = Object.values(part.pins).find((n) => n !== cursor);
        if (next === void 0) break;
        if (isSupply(next) && !groundNets.has(next)) rails.add(next);
        cursor = next;
      }
      for (const rail of rails) {
        const list2 = byRail.get(rail) ?? [];
        list2.push({ part: first, device, ohms, path: path.parts });
        byRail.set(rail, list2);
      }
    }
    return byRail;
  });
  const built = lazy(() => {
    const railVolts = {};
    for (const rail of railSurvey().rails) {
      if (rail.from === "config" || rail.from === "name") railVolts[rail.net] = rail.volts;
    }
    const modelsText = [...circuit.modelLibraries.map((m) => m.text), ...extras.modelsText ? [extras.modelsText] : []].join("\n");
    return buildSolver(circuit, railVolts, modelsText === "" ? void 0 : modelsText);
  });
  const leaked = lazy(() => {
    const b = built();
    if (!b.ok) return void 0;
    const { circuit: solver, nodes } = withDcLeaks(b.build.solver);
    const notes = nodes.length === 0 ? b.build.notes : [...b.build.notes, { message: `no DC path at ${nodes.join(", ")}: held at ground through 1 G\u03A9 for the operating point` }];
    return { ...b.build, solver, notes };
  });
  const solverBuild = () => leaked();
  const op = lazy(() => {
    const build = solverBuild();
    if (!build) return { problem: built().ok ? "no solver netlist" : built().problem };
    const result = solveDc(build.solver);
    if (!result.converged) return { problem: result.problem ?? "the DC operating point did not converge" };
    return { op: result };
  });
  const overrideCache = /* @__PURE__ */ new Map();
  const limitations = [];
  const railReports = [];
  const baseReports = [];
  const biasCache = /* @__PURE__ */ new Map();
  const capacitorCache = /* @__PURE__ */ new Map();
  const acNetwork = lazy(() => {
    const build = solverBuild();
    if (!build) return void 0;
    const partRefs = new Set(circuit.parts.map((p) => p.ref));
    const elements = build.solver.elements.filter((e) => e.kind !== "V" || partRefs.has(e.name));
    const nodes = /* @__PURE__ */ new Set();
    for (const e of elements) for (const n of elementNodes(e)) nodes.add(n);
    nodes.delete("0");
    const leaks = [...nodes].map((n) => ({ kind: "R", name: `Rleak_${n}`, a: n, b: "0", ohms: 1e9 }));
    return { title: build.solver.title, elements: [...elements, ...leaks] };
  });
  const ctx = {
    circuit,
    config,
    band,
    report: {
      rails: railReports,
      bases: baseReports,
      addRail: (rail) => railReports.push(rail),
      addBase: (base) => baseReports.push(base),
      devices: () => deviceTable(op().op)
    },
    ground: () => [...groundNets],
    isGround,
    rails: () => railSurvey().rails,
    rail: (net) => railByNet().get(net),
    unresolvedRails: () => railSurvey().unresolved,
    isSupply,
    part: (ref) => index.part(ref),
    partsOn: (net) => index.partsOn(net),
    netOf: (ref, role) => {
      const part = index.part(ref);
      return part ? netOfRole(part, role) : void 0;
    },
    devices,
    stages,
    stage: (ref) => stages().find((s) => s.ref === ref),
    stacks,
    groundingCapacitors: (net) => groundingCapacitors(net, index, acTest),
    supplyPath: (net) => pathToSupply(net, index, acTest),
    railLoads: (rail) => railLoads().get(rail) ?? [],
    dcNetwork: (net) => dcNeighbourhood(net, index, isSupply),
    bias(ref, role) {
      const key = `${ref}:${role}`;
      if (biasCache.has(key)) return biasCache.get(key);
      const value = computeBias(ref, role);
      biasCache.set(key, value);
      return value;
    },
    solver: solverBuild,
    solverProblem: () => {
      const b = built();
      return b.ok ? void 0 : b.problem;
    },
    operatingPoint: () => op().op,
    operatingPointProblem: () => op().problem,
    operatingPointWith(overrides) {
      const keys = Object.keys(overrides).sort(naturalCompare2);
      const key = keys.map((k) => `${k}=${overrides[k]}`).join(";");
      if (overrideCache.has(key)) return overrideCache.get(key);
      const build = solverBuild();
      let result;
      if (build) {
        const elements = build.solver.elements.map((e) => {
          const ohms = overrides[e.name];
          return e.kind === "R" && ohms !== void 0 ? { ...e, ohms } : e;
        });
        const solved = solveDc({ title: build.solver.title, elements });
        result = solved.converged ? solved : void 0;
      }
      overrideCache.set(key, result);
      return result;
    },
    voltage(net) {
      const build = solverBuild();
      const point = op().op;
      if (!build || !point) return void 0;
      if (groundNets.has(net)) return 0;
      const node = build.nodeOfNet[net];
      return node === void 0 ? void 0 : point.nodeVoltages[node];
    },
    device(ref, channel2) {
      const devices2 = op().op?.devices;
      if (!devices2) return void 0;
      if (channel2 !== void 0) return devices2[`${ref}.${channel2}`];
      return devices2[ref] ?? devices2[`${ref}.g1`];
    },
    rating: (ref) => solverBuild()?.ratings[ref],
    saturationEdge(ref, channel2) {
      const device = ctx.device(ref, channel2);
      if (!device) return void 0;
      const name = channel2 !== void 0 ? `${ref}.${channel2}` : op().op?.devices[ref] ? ref : `${ref}.g1`;
      return saturationEdge(device, cardOf(solverBuild()?.solver.elements ?? [], name), ctx.rating(ref));
    },
    dissipation(ref) {
      const part = index.part(ref);
      const point = op().op;
      return part && point ? partDissipation(part, point, (net) => ctx.voltage(net)) : void 0;
    },
    resistorPowerRating(ref, fallbackWatts) {
      const part = index.part(ref);
      return part?.kind === "resistor" ? resistorPowerRating(part, fallbackWatts) : void 0;
    },
    unmodelled: () => solverBuild()?.unmodelled ?? [],
    impedance(net, frequencies, options8) {
      const network = whatIf(options8, frequencies);
      const node = ctx.nodeOf(net);
      if (!network || node === void 0) return void 0;
      const point = options8.passiveOnly ? null : op().op;
      if (point === void 0) return void 0;
      return impedanceAt(network, point, node, [...frequencies], options8.passiveOnly);
    },
    impedanceBetween(a, b, frequencies, options8) {
      const network = whatIf(options8, frequencies);
      const nodeA = ctx.nodeOf(a);
      const nodeB = ctx.nodeOf(b);
      if (!network || nodeA === void 0 || nodeB === void 0) return void 0;
      const point = options8.passiveOnly ? null : op().op;
      if (point === void 0) return void 0;
      return impedanceBetweenAt(network, point, nodeA, nodeB, [...frequencies], options8.passiveOnly);
    },
    transfer(input, output, frequencies) {
      const build = solverBuild();
      const point = op().op;
      const a = ctx.nodeOf(input);
      const b = ctx.nodeOf(output);
      if (!build || !point || a === void 0 || b === void 0) return void 0;
      return transferAt(build.solver, point, a, b, [...frequencies]);
    },
    frequencies: (perDecade = 40) => logGrid(band.low / 10, band.high * 10, perDecade, [band.low, band.high]),
    capacitor(ref) {
      if (capacitorCache.has(ref)) return capacitorCache.get(ref);
      const part = index.part(ref);
      const model = part ? capacitorModel(part) : void 0;
      capacitorCache.set(ref, model);
      return model;
    },
    capacitorLike(ref, farads) {
      const template = ref === void 0 ? void 0 : index.part(ref);
      return capacitorModel(hypotheticalCapacitor(template, farads));
    },
    seriesValues: (series2, from, to) => seriesBetween(series2, from, to),
    snapUp(value, series2) {
      const candidates3 = seriesBetween(series2, value / 10, value * 10);
      return candidates3.find((v) => v >= value * (1 - 1e-9)) ?? value;
    },
    snapNearest(value, series2) {
      const candidates3 = seriesBetween(series2, value / 10, value * 10);
      let best = value;
      let bestDistance = Number.POSITIVE_INFINITY;
      for (const v of candidates3) {
        const d = Math.abs(Math.log(v / value));
        if (d < bestDistance) {
          best = v;
          bestDistance = d;
        }
      }
      return best;
    },
    nodeOf(net) {
      if (groundNets.has(net)) return "0";
      return solverBuild()?.nodeOfNet[net];
    },
    thermalVoltage,
    noteLimited(rule, reason, parts = []) {
      const same = limitations.find((l) => l.rule === rule && l.reason === reason);
      if (same) {
        for (const p of parts) if (!same.parts.includes(p)) same.parts.push(p);
      } else limitations.push({ rule, reason, parts: [...parts] });
    },
    limitations: () => limitations
  };
  function whatIf(options8, frequencies) {
    const base = options8.passiveOnly ? acNetwork() : solverBuild()?.solver;
    if (!base) return void 0;
    const nothingChanged = !options8.without?.length && !options8.shorted?.length && !options8.extra?.length;
    if (nothingChanged) return base;
    const without = new Set(options8.without ?? []);
    const shorted = new Set(options8.shorted ?? []);
    const lowest = Math.min(...frequencies);
    const shortFarads = 1e3 / (2 * Math.PI * (Number.isFinite(lowest) && lowest > 0 ? lowest : 1));
    const elements = [];
    for (const e of base.elements) {
      if (without.has(e.name)) continue;
      if (e.kind === "C" && shorted.has(e.name)) elements.push({ kind: "C", name: e.name, a: e.a, b: e.b, farads: shortFarads });
      else elements.push(e);
    }
    elements.push(...options8.extra ?? []);
    const changed = { title: base.title, elements };
    return options8.passiveOnly ? changed : withDcLeaks(changed).circuit;
  }
  function computeBias(ref, role) {
    const part = index.part(ref);
    const net = part ? netOfRole(part, role) : void 0;
    if (!part || net === void 0) return void 0;
    const neighbourhood = dcNeighbourhood(net, index, isSupply);
    const partsInvolved = neighbourhood.parts.map((p) => p.ref).sort(naturalCompare2);
    if (groundNets.has(net)) return { volts: 0, ohms: 0, parts: [] };
    const reachesSupply = neighbourhood.nets.some((n) => isSupply(n)) || neighbourhood.nets.some((n) => index.partsOn(n).some(({ part: p }) => p.kind === "battery" || p.kind === "voltage-source"));
    if (!reachesSupply) return { volts: Number.NaN, ohms: Number.POSITIVE_INFINITY, parts: partsInvolved };
    const build = solverBuild();
    const node = build?.nodeOfNet[net];
    if (!build || node === void 0) return void 0;
    const elements = build.solver.elements.filter((e) => !isTransistorElement(e));
    const open = solveDc({ title: build.solver.title, elements });
    const testAmps = 1e-6;
    const probe2 = { kind: "I", name: "Iprobe_bias", pos: "0", neg: node, dc: testAmps };
    const loaded = solveDc({ title: build.solver.title, elements: [...elements, probe2] });
    const v0 = open.nodeVoltages[node];
    const v1 = loaded.nodeVoltages[node];
    if (!open.converged || !loaded.converged || v0 === void 0 || v1 === void 0) return void 0;
    return { volts: v0, ohms: (v1 - v0) / testAmps, parts: partsInvolved };
  }
  return ctx;
}
function isTransistorElement(e) {
  return e.kind === "Q" || e.kind === "J" || e.kind === "M";
}
function elementNodes(e) {
  switch (e.kind) {
    case "R":
    case "C":
    case "L":
      return [e.a, e.b];
    case "V":
    case "I":
      return [e.pos, e.neg];
    case "D":
      return [e.anode, e.cathode];
    case "Q":
      return [e.c, e.b, e.e];
    case "J":
      return [e.d, e.g, e.s];
    case "M":
      return [e.d, e.g, e.s, e.b];
  }
}
function loadOhms(part, lowHertz) {
  const value = part.parsed.number;
  if (value === void 0 || !(value > 0)) return void 0;
  if (part.kind === "resistor") return value;
  if (part.kind === "inductor") return 2 * Math.PI * lowHertz * value;
  return void 0;
}
function withDcLeaks(circuit) {
  const nodes = [...new Set(diagnoseTopology(circuit).filter((p) => p.kind === "no-dc-path").flatMap((p) => p.nodes))].filter((n) => n !== "0");
  if (nodes.length === 0) return { circuit, nodes };
  const leaks = nodes.map((n) => ({ kind: "R", name: `Rleak_${n}`, a: n, b: "0", ohms: 1e9 }));
  return { circuit: { title: circuit.title, elements: [...circuit.elements, ...leaks] }, nodes };
}
function hypotheticalCapacitor(template, farads) {
  const base = template ?? {
    ref: "Cnew",
    value: "",
    kind: "capacitor",
    libId: "Device:C",
    footprint: "Capacitor_SMD:C_0603_1608Metric",
    pins: {},
    pinNames: {},
    roles: { "1": "1", "2": "2" },
    fields: {},
    dnp: false,
    excludedFromSim: false,
    parsed: { text: "" },
    origin: { file: "", line: 0, column: 0, sheetPath: "/" }
  };
  const fields = { ...base.fields };
  for (const key of Object.keys(fields)) if (/^(esr|esl|srf)$/i.test(key)) delete fields[key];
  return { ...base, ref: "Cnew", value: "", fields, parsed: { ...base.parsed, text: "", number: farads } };
}
function seriesBetween(series2, from, to) {
  const decade = seriesDecade(series2);
  const out = [];
  const first = Math.floor(Math.log10(from)) - 1;
  const last = Math.ceil(Math.log10(to)) + 1;
  for (let exponent = first; exponent <= last; exponent++) {
    for (const mantissa of decade) {
      const v = Number((mantissa * 10 ** exponent).toPrecision(4));
      if (v >= from * (1 - 1e-9) && v <= to * (1 + 1e-9)) out.push(v);
    }
  }
  return out;
}
function logGrid(from, to, perDecade, include = []) {
  const decades = Math.log10(to / from);
  const steps = Math.max(1, Math.ceil(decades * perDecade));
  const points = [];
  for (let i = 0; i <= steps; i++) points.push(from * 10 ** (decades * i / steps));
  for (const f of include) if (f >= from && f <= to) points.push(f);
  points.sort((a, b) => a - b);
  return points.filter((f, i) => i === 0 || f / (points[i - 1] ?? f) > 1 + 1e-9);
}
var TABLE_FIGURES = {
  bjt: ["vbe", "vce", "ic", "ib", "power", "gm", "cpi", "cmu"],
  jfet: ["vgs", "vds", "id", "power", "gm", "gds", "cgs", "cgd"],
  mosfet: ["vgs", "vds", "id", "vth", "power", "gm", "gds", "cgs", "cgd"],
  diode: ["vd", "id", "power"]
};
function deviceTable(point) {
  if (!point) return [];
  return Object.entries(point.devices).sort(([a], [b]) => naturalCompare2(a, b)).map(([ref, d]) => {
    const figures = {};
    const all = d;
    for (const k of TABLE_FIGURES[d.kind]) {
      const v = all[k];
      if (typeof v === "number" && Number.isFinite(v)) figures[k] = v;
    }
    return { ref, type: d.kind === "diode" ? "diode" : d.type, region: d.region, figures };
  });
}

// src/engine/expand.ts
import { readdirSync, statSync as statSync2 } from "node:fs";
import { basename, dirname as dirname5, extname, isAbsolute as isAbsolute3, join as join4, relative as relative2, resolve as resolve2, sep } from "node:path";

// src/engine/glob.ts
function tokenize(pattern) {
  const tokens2 = [];
  for (let i = 0; i < pattern.length; i++) {
    const c = pattern[i];
    if (c === "*" && pattern[i + 1] === "*") {
      const atStart = i === 0 || pattern[i - 1] === "/";
      if (atStart && pattern[i + 2] === "/") {
        tokens2.push({ t: "dirs" });
        i += 2;
      } else if (i > 0 && pattern[i - 1] === "/" && i + 2 === pattern.length) {
        tokens2.pop();
        tokens2.push({ t: "rest" });
        i += 1;
      } else {
        tokens2.push({ t: "any" });
        i += 1;
      }
    } else if (c === "*") {
      tokens2.push({ t: "star" });
    } else if (c === "?") {
      tokens2.push({ t: "one" });
    } else if (c === "[") {
      const close = pattern.indexOf("]", i + 2);
      if (close < 0) {
        tokens2.push({ t: "char", c });
        continue;
      }
      let body = pattern.slice(i + 1, close);
      const negate = body.startsWith("!") || body.startsWith("^");
      if (negate) body = body.slice(1);
      const ranges = [];
      for (let k = 0; k < body.length; k++) {
        const from = body[k];
        if (body[k + 1] === "-" && k + 2 < body.length) {
          ranges.push([from, body[k + 2]]);
          k += 2;
        } else ranges.push([from, from]);
      }
      tokens2.push({ t: "class", negate, ranges });
      i = close;
    } else {
      tokens2.push({ t: "char", c });
    }
  }
  return tokens2;
}
function matchTokens(tokens2, text) {
  const n = text.length;
  let next = new Array(n + 1).fill(false);
  next[n] = true;
  for (let p = tokens2.length - 1; p >= 0; p--) {
    const token = tokens2[p];
    const cur = new Array(n + 1).fill(false);
    let acc = false;
    for (let s = n; s >= 0; s--) {
      const ch = text[s];
      switch (token.t) {
        case "char":
          cur[s] = ch === token.c && next[s + 1] === true;
          break;
        case "one":
          cur[s] = ch !== void 0 && ch !== "/" && next[s + 1] === true;
          break;
        case "class": {
          const inClass = ch !== void 0 && ch !== "/" && token.ranges.some(([a, b]) => ch >= a && ch <= b);
          cur[s] = ch !== void 0 && ch !== "/" && inClass !== token.negate && next[s + 1] === true;
          break;
        }
        case "star":
          cur[s] = next[s] === true || ch !== void 0 && ch !== "/" && cur[s + 1] === true;
          break;
        case "any":
          cur[s] = next[s] === true || ch !== void 0 && cur[s + 1] === true;
          break;
        case "dirs":
          if (s < n && text[s] === "/" && next[s + 1] === true) acc = true;
          cur[s] = next[s] === true || acc;
          break;
        case "rest":
          if (s < n && next[s + 1] === true) acc = true;
          cur[s] = next[s] === true || ch === "/" && (acc || next[s + 1] === true);
          break;
      }
    }
    next = cur;
  }
  return next[0] === true;
}
function normalizePath(path) {
  let p = path.replace(/\\/g, "/");
  while (p.startsWith("./")) p = p.slice(2);
  return p;
}
function matchesGlob(path, glob, options8 = {}) {
  const target = normalizePath(path);
  let pattern = normalizePath(glob.trim());
  if (pattern === "") return false;
  if (pattern.endsWith("/")) pattern = pattern.slice(0, -1);
  if (options8.anchored) return matchTokens(tokenize(pattern), target);
  if (!pattern.includes("/")) pattern = `**/${pattern}`;
  if (pattern.startsWith("/")) pattern = pattern.slice(1);
  const tokens2 = tokenize(pattern);
  if (matchTokens(tokens2, target)) return true;
  for (let i = target.indexOf("/"); i >= 0; i = target.indexOf("/", i + 1)) {
    if (matchTokens(tokens2, target.slice(0, i))) return true;
  }
  return false;
}
function isGlob(text) {
  return /[*?[]/.test(text);
}

// src/engine/expand.ts
var DESIGN_EXTENSIONS = [".kicad_sch", ".net"];
function nodePathLister() {
  return {
    kind(path) {
      try {
        const st = statSync2(path);
        return st.isDirectory() ? "directory" : st.isFile() ? "file" : "missing";
      } catch {
        return "missing";
      }
    },
    list(dir) {
      try {
        return readdirSync(dir);
      } catch (err) {
        return { error: err instanceof Error ? err.message : String(err) };
      }
    }
  };
}
var MAX_DEPTH2 = 32;
var MAX_ENTRIES = 2e5;
function isDesignFile(name) {
  if (name.startsWith("_autosave-") || name.startsWith("~")) return false;
  return DESIGN_EXTENSIONS.includes(extname(name));
}
function skipFolder(name) {
  return name.startsWith(".") || name === "node_modules" || name.endsWith("-backups") || name === "dist";
}
function shown2(path, cwd) {
  const rel = relative2(cwd, path);
  return rel !== "" && rel !== ".." && !rel.startsWith(`..${sep}`) && !isAbsolute3(rel) ? rel : path;
}
function expandPaths(inputs, lister, cwd) {
  const problems = [];
  const out = [];
  const seen = /* @__PURE__ */ new Set();
  let entries = 0;
  const add = (abs, explicit) => {
    if (seen.has(abs)) return;
    seen.add(abs);
    out.push({ path: shown2(abs, cwd), explicit });
  };
  const walk = (dir, depth, accept, found) => {
    if (depth > MAX_DEPTH2 || entries > MAX_ENTRIES) return;
    const names = lister.list(dir);
    if (!Array.isArray(names)) {
      problems.push({ file: shown2(dir, cwd), line: 0, column: 0, message: `cannot list folder: ${names.error}` });
      return;
    }
    const sorted = [...names].sort();
    const stems = new Set(sorted.filter((n) => n.endsWith(".kicad_sch")).map((n) => n.slice(0, -".kicad_sch".length)));
    for (const name of sorted) {
      entries++;
      if (entries > MAX_ENTRIES) {
        problems.push({ file: shown2(dir, cwd), line: 0, column: 0, message: `stopped after ${MAX_ENTRIES} entries; name the design folders instead` });
        return;
      }
      const abs = join4(dir, name);
      const kind = lister.kind(abs);
      if (kind === "directory") {
        if (!skipFolder(name)) walk(abs, depth + 1, accept, found);
      } else if (kind === "file" && isDesignFile(name)) {
        if (name.endsWith(".net") && stems.has(name.slice(0, -".net".length))) continue;
        if (accept(abs)) found.push(abs);
      }
    }
  };
  for (const input of inputs) {
    if (isGlob(input)) {
      const pattern = normalizePath(input);
      const segments = pattern.split("/");
      const firstGlob = segments.findIndex(isGlob);
      const base = resolve2(cwd, segments.slice(0, Math.max(0, firstGlob)).join("/") || ".");
      const found = [];
      if (lister.kind(base) === "directory") {
        const absPattern = normalizePath(resolve2(cwd, pattern));
        walk(base, 0, (abs2) => matchesGlob(normalizePath(abs2), absPattern, { anchored: true }), found);
      }
      if (found.length === 0) problems.push({ file: input, line: 0, column: 0, message: "no .kicad_sch or .net file matches this pattern" });
      for (const f of found.sort()) add(f, false);
      continue;
    }
    const abs = resolve2(cwd, input);
    const kind = lister.kind(abs);
    if (kind === "file") add(abs, true);
    else if (kind === "directory") {
      const found = [];
      walk(abs, 0, () => true, found);
      if (found.length === 0) problems.push({ file: input, line: 0, column: 0, message: "no .kicad_sch or .net file in this folder" });
      for (const f of found.sort()) add(f, false);
    } else {
      problems.push({ file: input, line: 0, column: 0, message: "no such file or folder" });
    }
  }
  return { files: out, problems };
}

// src/engine/result.ts
var RANK = { error: 3, warning: 2, note: 1 };
function allFindings(result) {
  return result.designs.flatMap((d) => d.findings);
}
function countBySeverity(result) {
  const counts = { error: 0, warning: 0, note: 0, suppressed: 0 };
  for (const finding3 of allFindings(result)) {
    if (finding3.suppressed) counts.suppressed++;
    else counts[finding3.severity]++;
  }
  return counts;
}
function hasRunErrors(result) {
  return (result.errors?.length ?? 0) > 0 || result.designs.some((d) => d.errors.length > 0);
}
function exitCodeFor(result, failOn) {
  if (hasRunErrors(result)) return 2;
  if (failOn === "never") return 0;
  const threshold = RANK[failOn];
  return allFindings(result).some((f) => !f.suppressed && RANK[f.severity] >= threshold) ? 1 : 0;
}
function compareFindings(a, b) {
  return compareText(a.file, b.file) || a.line - b.line || a.column - b.column || compareText(a.rule, b.rule) || compareText(a.message, b.message);
}
function compareByImportance(a, b) {
  return RANK[b.severity] - RANK[a.severity] || compareFindings(a, b);
}
function compareText(a, b) {
  return a < b ? -1 : a > b ? 1 : 0;
}

// src/engine/runner.ts
function ruleLevel(rule, config) {
  return config.rules[rule.id]?.severity ?? rule.severity;
}
function runRules(rules, ctx, config, where4) {
  const findings = [];
  const problems = [];
  for (const rule of rules) {
    const level = ruleLevel(rule, config);
    if (level === "off") continue;
    const configured = config.rules[rule.id];
    const options8 = resolveRuleOptions(rule, configured?.options);
    let produced;
    try {
      produced = rule.check(ctx, options8);
    } catch (err) {
      const message = err instanceof Error ? err.message : String(err);
      problems.push({
        file: where4,
        line: 0,
        column: 0,
        message: `rule '${rule.id}' stopped with an internal error (a bug in loadline, please report it): ${message}`
      });
      continue;
    }
    for (const finding3 of produced) {
      findings.push({
        ...finding3,
        rule: rule.id,
        severity: configured?.severity !== void 0 ? level : finding3.severity
      });
    }
  }
  return { findings, problems };
}

// src/engine/suppress.ts
var SUPPRESS_FIELD = "loadline-ignore";
function fieldValue3(part) {
  for (const [name, value] of Object.entries(part.fields)) {
    if (name.trim().toLowerCase() === SUPPRESS_FIELD) return value;
  }
  return void 0;
}
function readSuppression(part) {
  const raw = fieldValue3(part);
  if (raw === void 0 || raw.trim() === "") return void 0;
  const colon = raw.indexOf(":");
  const list2 = colon < 0 ? raw : raw.slice(0, colon);
  const reason = colon < 0 ? "" : raw.slice(colon + 1).trim();
  const ids = list2.split(/[\s,;]+/).map((s) => s.trim().toLowerCase()).filter((s) => s !== "");
  return { ref: part.ref, rules: ids.includes("all") ? "all" : ids, reason };
}
function applySuppressions(findings, parts) {
  const byRef2 = /* @__PURE__ */ new Map();
  for (const part of parts) {
    const suppression = readSuppression(part);
    if (suppression) byRef2.set(part.ref, suppression);
  }
  return findings.map((finding3) => {
    if (finding3.suppressed) return { ...finding3 };
    for (const ref of finding3.parts) {
      const s = byRef2.get(ref);
      if (s && (s.rules === "all" || s.rules.includes(finding3.rule))) {
        const reason = s.reason !== "" ? s.reason : `${SUPPRESS_FIELD} on ${ref}, no reason given`;
        return { ...finding3, suppressed: { reason } };
      }
    }
    return { ...finding3 };
  });
}
function suppressionProblems(parts, knownRuleIds) {
  const problems = [];
  for (const part of parts) {
    const s = readSuppression(part);
    if (!s || s.rules === "all") continue;
    for (const id of s.rules) {
      if (!knownRuleIds.includes(id)) {
        problems.push({
          file: part.origin.file,
          line: part.origin.line,
          column: part.origin.column,
          message: `${part.ref}: field '${SUPPRESS_FIELD}' names unknown rule '${id}' (\`loadline rules\` lists them; write the ids, then ':' and a reason)`
        });
      }
    }
    if (s.rules.length === 0) {
      problems.push({
        file: part.origin.file,
        line: part.origin.line,
        column: part.origin.column,
        message: `${part.ref}: field '${SUPPRESS_FIELD}' names no rule; write rule ids or 'all', then ':' and a reason`
      });
    }
  }
  return problems;
}
function matchesIgnore(path, globs) {
  return globs.some((glob) => matchesGlob(path, glob));
}

// src/engine/lint.ts
function filesOnlyLister() {
  return { kind: () => "file", list: () => ({ error: "folders cannot be listed here" }) };
}
function textOf2(fs, path) {
  const data = fs.read(path);
  return Buffer.isBuffer(data) ? data.toString("utf8") : data;
}
function orderForRun(rules) {
  return [...rules.filter((r) => r.id !== "model-coverage"), ...rules.filter((r) => r.id === "model-coverage")];
}
function guarded(rule, circuit) {
  return {
    ...rule,
    check(ctx, options8) {
      try {
        return rule.check(ctx, options8);
      } catch (err) {
        const message = err instanceof Error ? err.message : String(err);
        const failure2 = {
          rule: rule.id,
          severity: "error",
          message: `Rule ${rule.id} stopped with an internal error, so this design was not fully checked by it (a bug in loadline; please report it with the design): ${message}`,
          parts: [],
          nets: [],
          file: circuit.file,
          line: 0,
          column: 0,
          sheetPath: "/",
          data: { internalError: true }
        };
        return [failure2];
      }
    }
  };
}
function lint(inputs) {
  const fs = inputs.fs ?? nodeFileSource();
  const lister = inputs.lister ?? (inputs.fs ? filesOnlyLister() : nodePathLister());
  const cwd = inputs.cwd ?? process.cwd();
  const rules = orderForRun(inputs.rules ?? allRules);
  const runErrors = [];
  const configCache = /* @__PURE__ */ new Map();
  const loadConfigFile = (path) => {
    if (configCache.has(path)) return configCache.get(path);
    const text = textOf2(fs, path);
    let choice;
    if (typeof text !== "string") {
      runErrors.push({ file: path, line: 0, column: 0, message: `cannot read the config: ${text.error}` });
    } else {
      const { config, errors } = loadConfig(text, path, rules);
      for (const e of errors) runErrors.push({ file: e.file, line: e.line, column: e.column, message: e.message });
      choice = errors.length === 0 ? { config, root: dirname6(resolve3(path)) } : void 0;
    }
    configCache.set(path, choice);
    return choice;
  };
  let fixed;
  if (inputs.config) fixed = { config: inputs.config, root: inputs.config.file ? dirname6(resolve3(inputs.config.file)) : resolve3(".") };
  else if (inputs.configPath !== void 0) {
    fixed = loadConfigFile(resolve3(cwd, inputs.configPath));
    if (!fixed) return emptyResult2(rules, runErrors, defaultConfig());
  }
  const configFor = (design2) => {
    if (fixed) return fixed;
    const found = findConfigFile(design2, fs);
    if (found === void 0) return { config: defaultConfig(), root: dirname6(resolve3(design2)) };
    return loadConfigFile(found);
  };
  const expanded = expandPaths(inputs.paths, lister, cwd);
  runErrors.push(...expanded.problems);
  const absolute = expanded.files.map((f) => ({ path: resolve3(cwd, f.path), explicit: f.explicit }));
  const explicit = new Set(absolute.filter((f) => f.explicit).map((f) => f.path));
  const candidates3 = absolute.map((f) => f.path).filter((file) => {
    if (explicit.has(file)) return true;
    const choice = configFor(file);
    return !choice || !matchesIgnore(relative3(choice.root, file), choice.config.ignore);
  });
  const roots = rootsOf(candidates3, explicit, fs);
  const designs = [];
  let bandConfig = fixed?.config;
  for (const file of roots) {
    const choice = configFor(file);
    if (!choice) {
      designs.push(failedDesign(file, `not checked: its config (${CONFIG_FILE_NAME}) has errors, listed above`));
      continue;
    }
    bandConfig ??= choice.config;
    designs.push(checkDesign(file, choice, fs, rules, inputs.visit));
  }
  return {
    designs,
    band: { ...(bandConfig ?? defaultConfig()).band },
    toolVersion: VERSION,
    rules: rules.map((r) => ({ id: r.id, title: r.title, severity: r.severity, doc: r.doc, options: r.options, ...r.tags ? { tags: r.tags } : {}, level: ruleLevel(r, bandConfig ?? defaultConfig()) })),
    ...runErrors.length > 0 ? { errors: runErrors } : {}
  };
}
function rootsOf(files, explicit, fs) {
  const sheets = files.filter((f) => f.endsWith(".kicad_sch"));
  if (sheets.length <= 1) return files;
  const found = findRootSheets(sheets, fs);
  const unreadable = new Set(found.errors.map((e) => e.file));
  const roots = /* @__PURE__ */ new Set([...found.roots, ...unreadable]);
  return files.filter((f) => !f.endsWith(".kicad_sch") || explicit.has(f) || roots.has(f));
}
function emptyResult2(rules, errors, config) {
  return {
    designs: [],
    band: { ...config.band },
    toolVersion: VERSION,
    rules: rules.map((r) => ({ id: r.id, title: r.title, severity: r.severity, doc: r.doc, options: r.options, level: ruleLevel(r, config) })),
    errors
  };
}
function failedDesign(file, message, line = 0, column = 0) {
  return { file, sheetFiles: [file], findings: [], rails: [], bases: [], devices: [], errors: [{ file, line, column, message }] };
}
function checkDesign(file, choice, fs, rules, visit) {
  const read = readDesign(file, { fs });
  if (!read.ok) return failedDesign(read.error.file, read.error.message, read.error.line, read.error.column);
  const circuit = read.circuit;
  const notes = circuit.notes.map((n) => ({ file: n.file, line: n.line, column: n.column, message: n.message }));
  let modelsText;
  if (choice.config.models !== void 0) {
    const path = resolve3(choice.root, choice.config.models);
    const text = textOf2(fs, path);
    if (typeof text === "string") modelsText = text;
    else notes.push({ file: choice.config.file ?? path, line: 0, column: 0, message: `models: cannot read ${choice.config.models} (${text.error}); built-in models used` });
  }
  const ctx = createContext(circuit, choice.config, modelsText === void 0 ? {} : { modelsText });
  const outcome = runRules(rules.map((r) => guarded(r, circuit)), ctx, choice.config, file);
  const findings = applySuppressions(outcome.findings, circuit.parts).sort(compareFindings);
  for (const p of suppressionProblems(circuit.parts, rules.map((r) => r.id))) notes.push(p);
  const sheetFiles = [.../* @__PURE__ */ new Set([circuit.file, ...circuit.sheets.map((s) => s.file)])];
  const design2 = {
    file,
    sheetFiles,
    findings,
    rails: ctx.report.rails,
    bases: ctx.report.bases,
    devices: ctx.report.devices(),
    errors: outcome.problems,
    ...notes.length > 0 ? { notes } : {}
  };
  visit?.(ctx, design2);
  return design2;
}

// src/cli/process-io.ts
function processIo() {
  return {
    stdout: (s) => process.stdout.write(s),
    stderr: (s) => process.stderr.write(s),
    cwd: process.cwd(),
    isTTY: process.stdout.isTTY === true,
    env: process.env
  };
}

// src/cli/bias.ts
function pad(cells) {
  const widths = [];
  for (const row of cells) row.forEach((c, i) => {
    widths[i] = Math.max(widths[i] ?? 0, c.length);
  });
  return cells.map((row) => row.map((c, i) => i === row.length - 1 ? c : c.padEnd(widths[i] ?? 0)).join("  ").trimEnd());
}
function deviceCells(d) {
  const name = d.channel ? `${d.ref}.${d.channel}` : d.ref;
  const q = (v, unit) => formatQuantity(v, unit);
  if ("vbe" in d) return [name, d.type, d.region, `VBE ${q(d.vbe, "V")}`, `VCE ${q(d.vce, "V")}`, `IC ${q(d.ic, "A")}`, `P ${q(d.power, "W")}`];
  return [name, d.type, d.region, `VGS ${q(d.vgs, "V")}`, `VDS ${q(d.vds, "V")}`, `ID ${q(d.id, "A")}`, `P ${q(d.power, "W")}`];
}
function formatBiasText(report, cwd) {
  const lines = [];
  const state = report.converged ? `DC solution converged (${report.method ?? "newton"})` : `no DC solution: ${report.problem ?? "the solver did not converge"}`;
  lines.push(`${relative4(cwd, report.file) || report.file}  \u2014  ${state}`);
  if (report.rails.length > 0) {
    lines.push("  Rails");
    const rows = report.rails.map((r) => [r.net, formatQuantity(r.volts, "V"), r.amps === null ? "\u2014" : formatQuantity(r.amps, "A"), `(voltage from ${r.from})`]);
    for (const l of pad(rows)) lines.push(`    ${l}`);
  }
  if (report.devices.length > 0) {
    lines.push("  Devices");
    for (const l of pad(report.devices.map(deviceCells))) lines.push(`    ${l}`);
  }
  if (report.unmodelled.length > 0) {
    lines.push("  Not simulated");
    for (const u of report.unmodelled) lines.push(`    ${u.ref}: ${u.reason}`);
  }
  return lines.join("\n") + "\n";
}
function runBias(paths, options8, io) {
  const reports = [];
  const result = lint({
    paths,
    rules: [],
    cwd: io.cwd,
    ...options8.config !== void 0 ? { configPath: options8.config } : {},
    visit: (ctx, design2) => reports.push(biasReport(ctx, design2.file))
  });
  let failed = (result.errors?.length ?? 0) > 0;
  for (const e of result.errors ?? []) io.stderr(`${relative4(io.cwd, e.file) || e.file}:${e.line}:${e.column}: error: ${e.message}
`);
  for (const design2 of result.designs) {
    if (reports.some((r) => r.file === design2.file)) continue;
    failed = true;
    for (const e of design2.errors) io.stderr(`${relative4(io.cwd, e.file) || e.file}:${e.line}:${e.column}: error: ${e.message}
`);
  }
  if (options8.json) for (const r of reports) io.stdout(JSON.stringify(r) + "\n");
  else io.stdout(reports.map((r) => formatBiasText(r, io.cwd)).join("\n"));
  return failed ? 2 : 0;
}
function register(program3) {
  program3.command("bias").description("print the DC operating point of each design: rails and their current, devices with region and Q-point").argument("<files...>", "design files (.kicad_sch, .net), folders or globs").option("--json", "one JSON object per design (SI units)").option("-c, --config <file>", "config file (default: the nearest loadline.json above each design)").action((files, opts) => {
    process.exitCode = runBias(files, { json: opts.json === true, ...opts.config !== void 0 ? { config: opts.config } : {} }, processIo());
  });
}

// src/cli/check.ts
import { mkdirSync, writeFileSync } from "node:fs";
import { dirname as dirname8, resolve as resolve6 } from "node:path";

// src/report/colors.ts
var import_picocolors = __toESM(require_picocolors(), 1);
var noColors = import_picocolors.default.createColors(false);
function createColors(enabled) {
  return import_picocolors.default.createColors(enabled);
}

// src/report/paths.ts
import { isAbsolute as isAbsolute4, relative as relative5, resolve as resolve4 } from "node:path";
function toPosix(path) {
  return path.replace(/\\/g, "/");
}
function relativeToRoot(file, base) {
  const absolute = isAbsolute4(file) ? file : resolve4(base.cwd, file);
  const rel = relative5(resolve4(base.root), absolute);
  if (rel === "" || isAbsolute4(rel)) return void 0;
  const posix2 = toPosix(rel);
  if (posix2 === ".." || posix2.startsWith("../")) return void 0;
  return posix2.replace(/^(\.\/)+/, "");
}
function displayPath(file, base) {
  return relativeToRoot(file, base) ?? toPosix(isAbsolute4(file) ? file : resolve4(base.cwd, file));
}

// src/report/github.ts
var LEVEL = { error: "error", warning: "warning", note: "notice" };
function escapeData(text) {
  return text.replace(/%/g, "%25").replace(/\r/g, "%0D").replace(/\n/g, "%0A");
}
function escapeProperty(text) {
  return escapeData(text).replace(/:/g, "%3A").replace(/,/g, "%2C");
}
function annotationLine(level, message, props = {}) {
  const fields = [];
  if (props.title) fields.push(`title=${escapeProperty(props.title)}`);
  if (props.file) {
    fields.push(`file=${escapeProperty(props.file)}`);
    if (props.line !== void 0 && props.line >= 1) {
      fields.push(`line=${props.line}`);
      if (props.col !== void 0 && props.col >= 1) fields.push(`col=${props.col}`);
    }
  }
  return `::${level}${fields.length > 0 ? ` ${fields.join(",")}` : ""}::${escapeData(message)}`;
}
function findingTitle(f) {
  return f.parts.length > 0 ? `loadline ${f.rule} (${f.parts.join(", ")})` : `loadline ${f.rule}`;
}
function formatAnnotations(result, options8) {
  const max = options8.maxPerLevel ?? 10;
  const problems = [...result.errors ?? [], ...result.designs.flatMap((d) => d.errors)];
  const findings = result.designs.flatMap((d) => d.findings).filter((f) => !f.suppressed).sort(compareByImportance);
  const plan = (noticeCap) => {
    const caps = { error: max, warning: max, notice: noticeCap };
    const shownProblems = problems.slice(0, caps.error);
    caps.error -= shownProblems.length;
    const shown3 = [];
    const overflow = [];
    for (const f of findings) {
      const level = LEVEL[f.severity];
      if (caps[level] > 0) {
        caps[level]--;
        shown3.push(f);
      } else overflow.push(f);
    }
    return { shownProblems, shown: shown3, overflow, hiddenProblems: problems.length - shownProblems.length };
  };
  let chosen = plan(max);
  if (chosen.overflow.length + chosen.hiddenProblems > 0) chosen = plan(Math.max(0, max - 1));
  const lines = [];
  for (const p of chosen.shownProblems) {
    lines.push(annotationLine("error", p.message, { title: "loadline could not check this file", file: displayPath(p.file, options8), line: p.line, col: p.column }));
  }
  for (const f of chosen.shown) {
    lines.push(annotationLine(LEVEL[f.severity], f.message, { title: findingTitle(f), file: displayPath(f.file, options8), line: f.line, col: f.column }));
  }
  const hidden = chosen.overflow.length + chosen.hiddenProblems;
  if (hidden > 0) {
    const noun = hidden === 1 ? "finding is" : "findings are";
    lines.push(annotationLine("notice", `${hidden} more ${noun} in ${options8.overflowPlace ?? "the job summary"}`, { title: "loadline" }));
  }
  return { lines, overflow: chosen.overflow };
}

// src/report/format.ts
function si2(value, unit) {
  if (Number.isNaN(value)) return "n/a";
  if (value === Infinity) return `\u221E ${unit}`;
  if (value === -Infinity) return `\u2212\u221E ${unit}`;
  return formatQuantity(value, unit);
}
function bandText2(band) {
  return `${si2(band.low, "Hz")} \u2013 ${si2(band.high, "Hz")}${band.isDefault ? " (default band)" : ""}`;
}
function plural2(count, singular, pluralForm = `${singular}s`) {
  return `${count} ${count === 1 ? singular : pluralForm}`;
}
function countsText(counts) {
  return `${plural2(counts.error, "error")}, ${plural2(counts.warning, "warning")}, ${plural2(counts.note, "note")}, ${counts.suppressed} suppressed`;
}

// src/report/sanitize.ts
function printable(text) {
  return text.replace(/[\u0000-\u001f\u007f-\u009f]/g, (c) => {
    if (c === "\n") return "\\n";
    if (c === "\r") return "\\r";
    if (c === "	") return "\\t";
    return `\\x${c.charCodeAt(0).toString(16).padStart(2, "0")}`;
  });
}
function clip(text, max) {
  if (text.length <= max) return text;
  let end = Math.max(0, max - 1);
  const code = text.charCodeAt(end - 1);
  if (code >= 55296 && code <= 56319) end--;
  return `${text.slice(0, end)}\u2026`;
}
var HTML_ENTITIES = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };
function escapeHtml(text) {
  return text.replace(/[&<>"'\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/g, (c) => HTML_ENTITIES[c] ?? "\uFFFD");
}

// src/report/svg-plot.ts
var MAX_DECADES = 24;
function usable(v) {
  return Number.isFinite(v) && v > 0;
}
function decadeRange(values) {
  const logs = values.filter(usable).map(Math.log10);
  if (logs.length === 0) return [0, 1];
  let lo = Math.floor(Math.min(...logs));
  let hi = Math.ceil(Math.max(...logs));
  if (hi <= lo) hi = lo + 1;
  if (hi - lo > MAX_DECADES) lo = hi - MAX_DECADES;
  return [lo, hi];
}
var r1 = (v) => (Math.round(v * 10) / 10).toString();
function logLogPlotSvg(plot) {
  const width = plot.width ?? 560;
  const height = plot.height ?? 300;
  const m = { left: 64, right: 36, top: 28, bottom: 44 };
  const pw = width - m.left - m.right;
  const ph = height - m.top - m.bottom;
  const xs = plot.curves.flatMap((c) => c.points.map((p) => p[0]));
  const ys = plot.curves.flatMap((c) => c.points.map((p) => p[1]));
  if (plot.band) xs.push(plot.band.low, plot.band.high);
  for (const l of plot.levels ?? []) ys.push(l.y);
  const [x0, x1] = decadeRange(xs);
  const [y0, y1] = decadeRange(ys);
  const sx = (x) => m.left + (Math.log10(x) - x0) / (x1 - x0) * pw;
  const sy = (y) => m.top + ph - (Math.log10(y) - y0) / (y1 - y0) * ph;
  const inX = (x) => usable(x) && Math.log10(x) >= x0 && Math.log10(x) <= x1;
  const inY = (y) => usable(y) && Math.log10(y) >= y0 && Math.log10(y) <= y1;
  const out = [];
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" class="plot" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${escapeHtml(plot.title)}">`);
  out.push(`<title>${escapeHtml(plot.title)}</title>`);
  if (plot.band && usable(plot.band.low) && usable(plot.band.high)) {
    const a = sx(plot.band.low);
    const b = sx(plot.band.high);
    out.push(`<rect class="plot-band" x="${r1(a)}" y="${m.top}" width="${r1(Math.max(0, b - a))}" height="${ph}"><title>band ${escapeHtml(si2(plot.band.low, plot.xUnit))} \u2013 ${escapeHtml(si2(plot.band.high, plot.xUnit))}</title></rect>`);
  }
  for (let k = x0; k <= x1; k++) {
    const x = sx(10 ** k);
    out.push(`<line class="plot-grid" x1="${r1(x)}" y1="${m.top}" x2="${r1(x)}" y2="${m.top + ph}" />`);
    out.push(`<text class="plot-tick" x="${r1(x)}" y="${m.top + ph + 16}" text-anchor="middle">${escapeHtml(si2(10 ** k, plot.xUnit))}</text>`);
    if (k < x1) {
      for (let n = 2; n <= 9; n++) {
        const xm = sx(n * 10 ** k);
        out.push(`<line class="plot-grid-minor" x1="${r1(xm)}" y1="${m.top}" x2="${r1(xm)}" y2="${m.top + ph}" />`);
      }
    }
  }
  for (let k = y0; k <= y1; k++) {
    const y = sy(10 ** k);
    out.push(`<line class="plot-grid" x1="${m.left}" y1="${r1(y)}" x2="${m.left + pw}" y2="${r1(y)}" />`);
    out.push(`<text class="plot-tick" x="${m.left - 6}" y="${r1(y + 4)}" text-anchor="end">${escapeHtml(si2(10 ** k, plot.yUnit))}</text>`);
    if (k < y1) {
      for (let n = 2; n <= 9; n++) {
        const ym = sy(n * 10 ** k);
        out.push(`<line class="plot-grid-minor" x1="${m.left}" y1="${r1(ym)}" x2="${m.left + pw}" y2="${r1(ym)}" />`);
      }
    }
  }
  out.push(`<rect class="plot-frame" x="${m.left}" y="${m.top}" width="${pw}" height="${ph}" />`);
  for (const level of plot.levels ?? []) {
    if (!inY(level.y)) continue;
    const y = r1(sy(level.y));
    const cls = `plot-level${level.className ? ` ${escapeHtml(level.className)}` : ""}`;
    out.push(`<line class="${cls}" x1="${m.left}" y1="${y}" x2="${m.left + pw}" y2="${y}"><title>${escapeHtml(level.label)}</title></line>`);
    out.push(`<text class="plot-level-label" x="${m.left + pw - 4}" y="${r1(sy(level.y) - 4)}" text-anchor="end">${escapeHtml(level.label)}</text>`);
  }
  for (const curve of plot.curves) {
    const segments = [];
    let pen = false;
    for (const [x, y] of curve.points) {
      if (!inX(x) || !inY(y)) {
        pen = false;
        continue;
      }
      segments.push(`${pen ? "L" : "M"}${r1(sx(x))} ${r1(sy(y))}`);
      pen = true;
    }
    if (segments.length === 0) continue;
    const cls = `plot-curve${curve.className ? ` ${escapeHtml(curve.className)}` : ""}`;
    out.push(`<path class="${cls}" d="${segments.join(" ")}"><title>${escapeHtml(curve.label)}</title></path>`);
  }
  out.push(`<text class="plot-axis" x="${m.left + pw / 2}" y="${height - 6}" text-anchor="middle">${escapeHtml(plot.xLabel ?? "frequency")}</text>`);
  out.push(`<text class="plot-axis" x="12" y="${m.top + ph / 2}" text-anchor="middle" transform="rotate(-90 12 ${m.top + ph / 2})">${escapeHtml(plot.yLabel ?? "|Z|")}</text>`);
  out.push(`<text class="plot-title" x="${m.left}" y="18">${escapeHtml(plot.title)}</text>`);
  out.push("</svg>");
  return out.join("\n");
}

// src/report/html.ts
var STYLE = `
:root { --fg: #1b1f24; --bg: #ffffff; --muted: #59636e; --line: #d1d9e0; --grid: #e6eaef;
  --error: #c62828; --warning: #a15c00; --note: #0b5cad; --ok: #1a7f37; --band: rgba(11, 92, 173, 0.10);
  --curve: #0b5cad; --level: #c62828; --card: #f6f8fa; }
@media (prefers-color-scheme: dark) {
  :root { --fg: #e6edf3; --bg: #0d1117; --muted: #9198a1; --line: #3d444d; --grid: #262c33;
    --error: #ff7b72; --warning: #e3b341; --note: #79c0ff; --ok: #56d364; --band: rgba(121, 192, 255, 0.14);
    --curve: #79c0ff; --level: #ff7b72; --card: #151b23; }
}
* { box-sizing: border-box; }
body { margin: 0 auto; max-width: 1100px; padding: 1.5rem; font: 15px/1.45 system-ui, -apple-system, "Segoe UI", sans-serif;
  color: var(--fg); background: var(--bg); }
h1 { font-size: 1.6rem; margin: 0 0 0.3rem; }
h2 { font-size: 1.25rem; margin: 2rem 0 0.6rem; padding-bottom: 0.2rem; border-bottom: 1px solid var(--line); overflow-wrap: anywhere; }
h3 { font-size: 1.05rem; margin: 1.4rem 0 0.5rem; }
code, .mono { font-family: ui-monospace, SFMono-Regular, Menlo, Consolas, monospace; font-size: 0.92em; }
a { color: var(--note); }
.muted { color: var(--muted); }
.summary { color: var(--muted); margin: 0 0 1rem; }
.sev { display: inline-block; min-width: 4.8em; font-weight: 600; }
.sev-error { color: var(--error); } .sev-warning { color: var(--warning); } .sev-note { color: var(--note); }
ol.findings { padding-left: 1.6rem; }
ol.findings li { margin: 0.45rem 0; overflow-wrap: anywhere; }
li.suppressed { opacity: 0.7; }
.where { color: var(--muted); font-size: 0.9em; }
table { border-collapse: collapse; margin: 0.4rem 0 1rem; font-size: 0.92em; }
th, td { border: 1px solid var(--line); padding: 0.25rem 0.55rem; text-align: left; vertical-align: top; overflow-wrap: anywhere; }
th { background: var(--card); }
td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
figure { margin: 0.6rem 0 1.2rem; padding: 0.6rem; background: var(--card); border: 1px solid var(--line); border-radius: 6px;
  break-inside: avoid; page-break-inside: avoid; max-width: 100%; overflow-x: auto; }
figcaption { font-size: 0.9em; margin-top: 0.3rem; overflow-wrap: anywhere; }
.ok { color: var(--ok); font-weight: 600; } .bad { color: var(--error); font-weight: 600; }
svg.plot { max-width: 100%; height: auto; color: var(--fg); }
svg.plot text { fill: currentColor; font: 11px system-ui, sans-serif; }
svg.plot .plot-title { font-weight: 600; font-size: 12px; }
svg.plot .plot-band { fill: var(--band); }
svg.plot .plot-grid { stroke: var(--line); stroke-width: 1; }
svg.plot .plot-grid-minor { stroke: var(--grid); stroke-width: 0.6; }
svg.plot .plot-frame { fill: none; stroke: var(--muted); stroke-width: 1; }
svg.plot .plot-curve { fill: none; stroke: var(--curve); stroke-width: 2; }
svg.plot .plot-level { stroke: var(--level); stroke-width: 1.4; stroke-dasharray: 6 4; }
svg.plot .plot-level-label { fill: var(--level); }
svg.plot .plot-curve.plot-limit { stroke: var(--level); stroke-width: 1.4; stroke-dasharray: 6 4; }
@media print {
  body { max-width: none; padding: 0; font-size: 11pt; color: #000; background: #fff; }
  nav { display: none; }
  a { color: inherit; text-decoration: none; }
  figure { background: none; }
  h2 { break-after: avoid; page-break-after: avoid; }
}
`;
function where2(file, line, column, o) {
  const path = displayPath(file, o);
  return line >= 1 ? `${path}:${line}:${Math.max(1, column)}` : path;
}
function figureUnit(key) {
  const k = key.toLowerCase();
  if (k.startsWith("g")) return "S";
  if (k.startsWith("v")) return "V";
  if (k.startsWith("i")) return "A";
  if (k.startsWith("r") || k.startsWith("z")) return "\u03A9";
  if (k.startsWith("p")) return "W";
  if (k.startsWith("f")) return "Hz";
  if (k.startsWith("c")) return "F";
  return "";
}
function figureText(key, value) {
  const unit = figureUnit(key);
  return unit ? si2(value, unit) : Number.isFinite(value) ? String(Number(value.toPrecision(4))) : "n/a";
}
function problemList(problems, o, heading) {
  if (problems.length === 0) return [];
  const out = [`<h3>${escapeHtml(heading)}</h3>`, `<ul class="problems">`];
  for (const p of problems) out.push(`<li><span class="mono where">${escapeHtml(where2(p.file, p.line, p.column, o))}</span> ${escapeHtml(p.message)}</li>`);
  out.push("</ul>");
  return out;
}
function findingItem(f, id, o) {
  const parts = f.parts.length > 0 ? ` <strong>${escapeHtml(f.parts.join(", "))}</strong>` : "";
  const suppressed = f.suppressed ? ` <span class="muted">(suppressed: ${escapeHtml(f.suppressed.reason)})</span>` : "";
  return `<li id="${id}" class="finding${f.suppressed ? " suppressed" : ""}"><span class="sev sev-${f.severity}">${f.severity}</span> <code>${escapeHtml(f.rule)}</code>${parts} \u2014 ${escapeHtml(f.message)}${suppressed}<br /><span class="mono where">${escapeHtml(where2(f.file, f.line, f.column, o))}${f.sheetPath ? ` \xB7 sheet ${escapeHtml(f.sheetPath)}` : ""}</span></li>`;
}
function designSection(d, index, band, o) {
  const out = [`<section id="d${index}">`, `<h2>${escapeHtml(displayPath(d.file, o))}</h2>`];
  if (d.sheetFiles.length > 1) {
    out.push(`<p class="muted">Sheets: ${d.sheetFiles.map((s) => `<span class="mono">${escapeHtml(displayPath(s, o))}</span>`).join(", ")}</p>`);
  }
  out.push(...problemList(d.errors, o, "Could not check"));
  const findings = [...d.findings].sort((a, b) => Number(Boolean(a.suppressed)) - Number(Boolean(b.suppressed)) || compareByImportance(a, b));
  const idOf = new Map(findings.map((f, j) => [f, `d${index}-f${j + 1}`]));
  out.push(`<h3>Findings</h3>`);
  if (findings.length === 0) out.push(`<p class="ok">No findings.</p>`);
  else {
    out.push(`<ol class="findings">`);
    for (const f of findings) out.push(findingItem(f, idOf.get(f) ?? "", o));
    out.push("</ol>");
  }
  const byPart = /* @__PURE__ */ new Map();
  for (const f of findings) for (const ref of f.parts) byPart.set(ref, [...byPart.get(ref) ?? [], f]);
  const refs = [...byPart.keys()].sort(compareText);
  const partAnchor = new Map(refs.map((ref, k) => [ref, `d${index}-p${k + 1}`]));
  const findingLinks = (ref) => (byPart.get(ref) ?? []).map((f) => `<a href="#${idOf.get(f) ?? ""}">${escapeHtml(f.rule)}</a>`).join(", ");
  if (refs.length > 0) {
    out.push(`<h3>Parts with findings</h3>`, `<table><thead><tr><th>part</th><th>findings</th></tr></thead><tbody>`);
    for (const ref of refs) out.push(`<tr id="${partAnchor.get(ref) ?? ""}"><td class="mono">${escapeHtml(ref)}</td><td>${findingLinks(ref)}</td></tr>`);
    out.push("</tbody></table>");
  }
  if (d.rails.length > 0) {
    out.push(`<h3>Rail impedance</h3>`);
    for (const r of [...d.rails].sort((a, b) => compareText(a.net, b.net))) {
      const svg = logLogPlotSvg({
        title: `${r.net} (${si2(r.volts, "V")}): |Z| to ground`,
        xUnit: "Hz",
        yUnit: "\u03A9",
        curves: [{ points: r.curve, label: `|Z| of ${r.net}` }],
        levels: [{ y: r.targetOhms, label: `target ${si2(r.targetOhms, "\u03A9")}` }],
        band
      });
      const verdict = r.worst ? r.worst.ohms <= r.targetOhms ? `<span class="ok">within target</span>: worst ${escapeHtml(si2(r.worst.ohms, "\u03A9"))} at ${escapeHtml(si2(r.worst.hertz, "Hz"))}` : `<span class="bad">over target</span>: worst ${escapeHtml(si2(r.worst.ohms, "\u03A9"))} at ${escapeHtml(si2(r.worst.hertz, "Hz"))}` : "no figure in band";
      out.push(`<figure class="rail">${svg}<figcaption><strong>${escapeHtml(r.net)}</strong> \u2014 target ${escapeHtml(si2(r.targetOhms, "\u03A9"))} (${escapeHtml(r.targetBasis)}); ${verdict}.</figcaption></figure>`);
    }
  }
  if (d.bases.length > 0) {
    out.push(`<h3>Cascode base grounding</h3>`);
    for (const b of [...d.bases].sort((x, y) => compareText(x.ref, y.ref))) {
      const svg = logLogPlotSvg({
        title: `${b.ref} base (${b.net}): |Z| to ground`,
        xUnit: "Hz",
        yUnit: "\u03A9",
        curves: [
          { points: b.curve, label: `|Z| of ${b.net}` },
          // The limit varies across the band; draw it as a dashed curve where it is known.
          ...b.limitCurve && b.limitCurve.length > 1 ? [{ points: b.limitCurve, label: "limit across the band", className: "plot-limit" }] : []
        ],
        levels: b.limitCurve && b.limitCurve.length > 1 ? [] : [{ y: b.limitOhms, label: `limit ${si2(b.limitOhms, "\u03A9")}` }],
        band
      });
      const link = partAnchor.has(b.ref) ? ` \xB7 <a href="#${partAnchor.get(b.ref) ?? ""}">findings</a>` : "";
      out.push(`<figure class="base">${svg}<figcaption><strong>${escapeHtml(b.ref)}</strong> on ${escapeHtml(b.net)} \u2014 limit (dashed) down to ${escapeHtml(si2(b.limitOhms, "\u03A9"))} in band${link}.</figcaption></figure>`);
    }
  }
  if (d.devices.length > 0) {
    const keys = [...new Set(d.devices.flatMap((v) => Object.keys(v.figures)))].sort(compareText);
    out.push(`<h3>Operating point</h3>`, `<table><thead><tr><th>part</th><th>type</th><th>region</th>${keys.map((k) => `<th>${escapeHtml(k)}</th>`).join("")}</tr></thead><tbody>`);
    for (const v of [...d.devices].sort((a, b) => compareText(a.ref, b.ref))) {
      const ref = partAnchor.has(v.ref) ? `<a href="#${partAnchor.get(v.ref) ?? ""}">${escapeHtml(v.ref)}</a>` : escapeHtml(v.ref);
      const cells = keys.map((k) => {
        const value = v.figures[k];
        return `<td class="num">${value === void 0 ? "\u2013" : escapeHtml(figureText(k, value))}</td>`;
      });
      out.push(`<tr><td class="mono">${ref}</td><td>${escapeHtml(v.type)}</td><td>${escapeHtml(v.region)}</td>${cells.join("")}</tr>`);
    }
    out.push("</tbody></table>");
  }
  out.push(...problemList(d.notes ?? [], o, "Notes"));
  out.push("</section>");
  return out;
}
function formatHtml(result, options8) {
  const title = options8.title ?? "loadline report";
  const designs = [...result.designs].sort((a, b) => compareText(a.file, b.file));
  const counts = countBySeverity(result);
  const out = [
    "<!DOCTYPE html>",
    `<html lang="en">`,
    "<head>",
    `<meta charset="utf-8" />`,
    `<meta name="viewport" content="width=device-width, initial-scale=1" />`,
    `<meta name="color-scheme" content="light dark" />`,
    `<title>${escapeHtml(title)}</title>`,
    `<style>${STYLE}</style>`,
    "</head>",
    "<body>",
    `<header><h1>${escapeHtml(title)}</h1>`,
    `<p class="summary">${escapeHtml(countsText(counts))} in ${escapeHtml(plural2(designs.length, "design"))} \xB7 band ${escapeHtml(bandText2(result.band))} \xB7 loadline ${escapeHtml(result.toolVersion)}</p></header>`
  ];
  out.push(...problemList(result.errors ?? [], options8, "Could not run"));
  if (designs.length > 1) {
    out.push(`<nav><ul>`);
    designs.forEach((d, i) => out.push(`<li><a href="#d${i + 1}">${escapeHtml(displayPath(d.file, options8))}</a></li>`));
    out.push(`</ul></nav>`);
  }
  designs.forEach((d, i) => out.push(...designSection(d, i + 1, result.band, options8)));
  out.push(
    `<footer><p class="muted">Figures come from loadline's own small-signal model of the schematic, not from measurement. Check them on the bench before relying on them.</p></footer>`,
    "</body>",
    "</html>"
  );
  return `${out.join("\n")}
`;
}

// src/report/sarif.ts
import { createHash } from "node:crypto";
import { pathToFileURL } from "node:url";

// src/engine/rule-doc.ts
function formatOptionDefault(option) {
  const value = Array.isArray(option.default) ? option.default.join(", ") : String(option.default);
  if (typeof option.default === "number" && option.unit) return `${value} ${option.unit}`;
  return value;
}
function ruleHelpText(rule) {
  const lines = [`${rule.id}: ${rule.title} (default severity: ${rule.severity})`, "", "What it checks", rule.doc.what, "", "Why it matters", rule.doc.why, "", "What to do", rule.doc.fix];
  const options8 = Object.entries(rule.options);
  if (options8.length > 0) {
    lines.push("", "Options");
    for (const [name, option] of options8) {
      const choices = option.enum ? ` (one of ${option.enum.join(", ")})` : "";
      lines.push(`  ${name} (${option.type}, default ${formatOptionDefault(option)})${choices}: ${option.description}`);
    }
  }
  if (rule.doc.references.length > 0) {
    lines.push("", "References");
    for (const ref of rule.doc.references) lines.push(`  - ${ref}`);
  }
  lines.push("", `Suppress on one part with the symbol field  loadline-ignore = "${rule.id}: <reason>"`);
  return lines.join("\n");
}
function md(text) {
  return text.replace(/[\\`*_[\]<>|]/g, (c) => `\\${c}`);
}
function ruleHelpMarkdown(rule) {
  const parts = [
    `**${md(rule.title)}** (\`${rule.id}\`, default severity: ${rule.severity})`,
    "",
    "## What it checks",
    md(rule.doc.what),
    "",
    "## Why it matters",
    md(rule.doc.why),
    "",
    "## What to do",
    md(rule.doc.fix)
  ];
  const options8 = Object.entries(rule.options);
  if (options8.length > 0) {
    parts.push("", "## Options", "", "| option | type | default | meaning |", "|---|---|---|---|");
    for (const [name, option] of options8) {
      const choices = option.enum ? ` One of ${option.enum.map((e) => `\`${e}\``).join(", ")}.` : "";
      parts.push(`| \`${name}\` | ${option.type} | ${md(formatOptionDefault(option))} | ${md(option.description)}${choices} |`);
    }
  }
  if (rule.doc.references.length > 0) {
    parts.push("", "## References", ...rule.doc.references.map((r) => `- ${md(r)}`));
  }
  parts.push("", `Suppress on one part with the symbol field \`loadline-ignore\` = \`${rule.id}: <reason>\`.`);
  return parts.join("\n");
}

// src/report/sarif.ts
var SARIF_SCHEMA_URI = "https://json.schemastore.org/sarif-2.1.0.json";
var FINGERPRINT_KEY = "loadlineFinding/v1";
var SRCROOT = "%SRCROOT%";
var PROBLEM_SEVERITY = { error: "error", warning: "warning", note: "recommendation" };
function ruleName(id) {
  return id.split(/[^a-zA-Z0-9]+/).filter(Boolean).map((w) => w[0]?.toUpperCase() + w.slice(1)).join("");
}
function descriptor(rule) {
  const level = rule.level ?? rule.severity;
  return {
    id: rule.id,
    name: ruleName(rule.id),
    shortDescription: { text: clip(rule.title || rule.id, 1024) },
    fullDescription: { text: clip(rule.doc.what || rule.title || rule.id, 1024) },
    help: { text: ruleHelpText(rule), markdown: ruleHelpMarkdown(rule) },
    defaultConfiguration: level === "off" ? { enabled: false, level: rule.severity } : { level },
    properties: {
      tags: ["loadline", ...rule.tags ?? []].slice(0, 20),
      precision: "high",
      "problem.severity": PROBLEM_SEVERITY[level === "off" ? rule.severity : level]
    }
  };
}
function placeholderRule(id) {
  return { id, title: id, severity: "warning", options: {}, doc: { what: id, why: "", fix: "", references: [] } };
}
function normaliseMessage(message) {
  return message.replace(/\d+(?:[.,]\d+)*(?:[eE][-+]?\d+)?/g, "#").replace(/\s+/g, " ").trim();
}
function fingerprint(finding3, file) {
  const parts = [...finding3.parts].sort();
  const nets = [...finding3.nets ?? []].sort();
  const key = JSON.stringify([finding3.rule, file, parts, nets, normaliseMessage(finding3.message)]);
  return createHash("sha256").update(key).digest("hex").slice(0, 32);
}
function encodePath(posixPath) {
  return posixPath.split("/").map(encodeURIComponent).join("/");
}
function artifactLocation(file, base) {
  const rel = relativeToRoot(file, base);
  if (rel !== void 0) return { uri: encodePath(rel), uriBaseId: SRCROOT };
  return { uri: pathToFileURL(displayPath(file, base)).href };
}
function location(file, line, column, base) {
  const physical = { artifactLocation: artifactLocation(file, base) };
  if (line >= 1) physical.region = column >= 1 ? { startLine: line, startColumn: column } : { startLine: line };
  return { physicalLocation: physical };
}
function fixOf(finding3, base) {
  if (!finding3.fix) return void 0;
  const { span, replacement, description } = finding3.fix;
  return [{
    description: { text: description },
    artifactChanges: [{
      artifactLocation: artifactLocation(span.file, base),
      replacements: [{ deletedRegion: { charOffset: span.start, charLength: span.end - span.start }, insertedContent: { text: replacement } }]
    }]
  }];
}
function notification(problem2, base) {
  return { level: "error", message: { text: problem2.message || "unknown problem" }, locations: [location(problem2.file, problem2.line, problem2.column, base)] };
}
function formatSarif(result, options8) {
  const rules = [...result.rules ?? []];
  const index = new Map(rules.map((r, i) => [r.id, i]));
  const findings = result.designs.flatMap((d) => d.findings).sort(compareFindings);
  for (const f of findings) {
    if (!index.has(f.rule)) {
      index.set(f.rule, rules.length);
      rules.push(placeholderRule(f.rule));
    }
  }
  const seen = /* @__PURE__ */ new Map();
  const results = findings.map((f) => {
    const file = relativeToRoot(f.file, options8) ?? displayPath(f.file, options8);
    const hash = fingerprint(f, file);
    const occurrence = (seen.get(hash) ?? 0) + 1;
    seen.set(hash, occurrence);
    const r = {
      ruleId: f.rule,
      ruleIndex: index.get(f.rule) ?? 0,
      level: f.severity,
      message: { text: f.message || f.rule },
      locations: [location(f.file, f.line, f.column, options8)],
      partialFingerprints: { [FINGERPRINT_KEY]: `${hash}:${occurrence}` },
      properties: { parts: f.parts, nets: f.nets, sheetPath: f.sheetPath, data: f.data }
    };
    const fixes = fixOf(f, options8);
    if (fixes) r.fixes = fixes;
    if (f.suppressed) r.suppressions = [{ kind: "inSource", status: "accepted", justification: f.suppressed.reason }];
    return r;
  });
  const problems = [...result.errors ?? [], ...result.designs.flatMap((d) => d.errors)];
  const root = pathToFileURL(options8.root).href.replace(/\/*$/, "/");
  const run = {
    tool: { driver: { name: "loadline", semanticVersion: result.toolVersion, version: result.toolVersion, rules: rules.map(descriptor) } },
    automationDetails: { id: options8.automationId ?? "loadline/" },
    originalUriBaseIds: { [SRCROOT]: { uri: root } },
    columnKind: "utf16CodeUnits",
    invocations: [{ executionSuccessful: !hasRunErrors(result), toolExecutionNotifications: problems.map((p) => notification(p, options8)) }],
    results
  };
  const log = { $schema: SARIF_SCHEMA_URI, version: "2.1.0", runs: [run] };
  return `${JSON.stringify(log, finiteOrNull, 2)}
`;
}
function finiteOrNull(_key, value) {
  return typeof value === "number" && !Number.isFinite(value) ? null : value;
}

// src/report/json.ts
var REPORT_SCHEMA_VERSION = 1;
function posix(path) {
  return path.replace(/\\/g, "/");
}
function problem(p, pathOf) {
  return { file: pathOf(p.file), line: p.line, column: p.column, message: p.message };
}
function finding2(f, design2, pathOf) {
  return {
    rule: f.rule,
    severity: f.severity,
    message: f.message,
    parts: f.parts,
    nets: f.nets,
    file: pathOf(f.file),
    line: f.line,
    column: f.column,
    sheetPath: f.sheetPath,
    design: pathOf(design2),
    data: f.data,
    suppressed: f.suppressed ? { reason: f.suppressed.reason } : null,
    fix: f.fix ? { file: pathOf(f.fix.span.file), start: f.fix.span.start, end: f.fix.span.end, replacement: f.fix.replacement, description: f.fix.description } : null
  };
}
function design(d, pathOf) {
  return {
    file: pathOf(d.file),
    sheetFiles: d.sheetFiles.map(pathOf),
    // Fields copied by name: the schema is the contract, whatever else the objects carry.
    rails: [...d.rails].sort((a, b) => compareText(a.net, b.net)).map((r) => ({
      net: r.net,
      volts: r.volts,
      targetOhms: r.targetOhms,
      targetBasis: r.targetBasis,
      curve: r.curve,
      ...r.worst ? { worst: { ohms: r.worst.ohms, hertz: r.worst.hertz } } : {}
    })),
    bases: [...d.bases].sort((a, b) => compareText(a.ref, b.ref)).map((b) => ({ ref: b.ref, net: b.net, curve: b.curve, limitOhms: b.limitOhms, ...b.limitCurve ? { limitCurve: b.limitCurve } : {} })),
    devices: [...d.devices].sort((a, b) => compareText(a.ref, b.ref)).map((v) => ({ ref: v.ref, type: v.type, region: v.region, figures: v.figures })),
    errors: d.errors.map((p) => problem(p, pathOf)),
    notes: (d.notes ?? []).map((p) => problem(p, pathOf))
  };
}
function formatJson(result, base) {
  const pathOf = base ? (p) => displayPath(p, base) : posix;
  const designs = [...result.designs].sort((a, b) => compareText(a.file, b.file));
  const findings = designs.flatMap((d) => d.findings.map((f) => ({ f, design: d.file }))).sort((a, b) => compareFindings(a.f, b.f) || compareText(a.design, b.design)).map(({ f, design: file }) => finding2(f, file, pathOf));
  const report = {
    schemaVersion: REPORT_SCHEMA_VERSION,
    tool: { name: "loadline", version: result.toolVersion },
    band: result.band,
    summary: { ...countBySeverity(result), designs: designs.length },
    findings,
    designs: designs.map((d) => design(d, pathOf)),
    errors: (result.errors ?? []).map((p) => problem(p, pathOf))
  };
  return `${JSON.stringify(report, finiteOrNull, 2)}
`;
}

// src/report/markdown.ts
var SUMMARY_BYTE_LIMIT = 1024 * 1024;
function escapeCell(text) {
  return text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/([\\`*_[\]|~])/g, "\\$1").replace(/\r\n|\r|\n/g, "<br>").replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/g, "\uFFFD");
}
var ICON = { error: "\u{1F534} error", warning: "\u{1F7E0} warning", note: "\u{1F535} note" };
function findingRow(f, o) {
  const path = displayPath(f.file, o);
  const where4 = f.line >= 1 ? `${path}:${f.line}:${Math.max(1, f.column)}` : path;
  const cells = [
    ICON[f.severity],
    `\`${f.rule}\``,
    escapeCell(f.parts.join(", ")) || "-",
    escapeCell(where4),
    escapeCell(clip(f.message, o.maxCellChars ?? 600)) || "-"
  ];
  return `| ${cells.join(" | ")} |`;
}
function render(result, o, rowLimit, cutNote) {
  const counts = countBySeverity(result);
  const designs = [...result.designs].sort((a, b) => compareText(a.file, b.file));
  const out = ["## loadline", ""];
  out.push(`**${countsText(counts)}** in ${plural2(designs.length, "design")} \xB7 band ${escapeCell(bandText2(result.band))}`, "");
  const problems = [...result.errors ?? [], ...designs.flatMap((d) => d.errors)];
  if (problems.length > 0) {
    out.push("### Could not check", "");
    for (const p of problems.slice(0, 100)) {
      const where4 = p.line >= 1 ? `${displayPath(p.file, o)}:${p.line}:${Math.max(1, p.column)}` : displayPath(p.file, o);
      out.push(`- ${escapeCell(where4)}: ${escapeCell(clip(p.message, 600))}`);
    }
    if (problems.length > 100) out.push(`- \u2026 and ${problems.length - 100} more`);
    out.push("");
  }
  const standing = designs.flatMap((d) => d.findings).filter((f) => !f.suppressed).sort(compareByImportance);
  if (standing.length > 0) {
    out.push("### Findings", "");
    const overflow = o.overflow?.length ?? 0;
    if (overflow > 0) out.push(`${plural2(overflow, "finding")} did not fit in the annotations; all are in this table.`, "");
    out.push("| severity | rule | parts | where | message |", "|---|---|---|---|---|");
    for (const f of standing.slice(0, rowLimit)) out.push(findingRow(f, o));
    if (standing.length > rowLimit) {
      out.push("", `Showing ${rowLimit} of ${standing.length} findings${cutNote}; the JSON and SARIF reports hold them all.`);
    }
    out.push("");
  }
  const rails = designs.flatMap((d) => d.rails.map((r) => ({ design: d.file, r })));
  if (rails.length > 0) {
    out.push("### Rail impedance in band", "", "| design | rail | volts | target | worst \\|Z\\| | at | |", "|---|---|---|---|---|---|---|");
    for (const { design: design2, r } of rails.slice(0, 200)) {
      const worst = r.worst ? si2(r.worst.ohms, "\u03A9") : "-";
      const at = r.worst ? si2(r.worst.hertz, "Hz") : "-";
      const ok = r.worst === void 0 ? "-" : r.worst.ohms <= r.targetOhms ? "\u2705" : "\u274C";
      out.push(`| ${escapeCell(displayPath(design2, o))} | ${escapeCell(r.net)} | ${si2(r.volts, "V")} | ${si2(r.targetOhms, "\u03A9")} | ${worst} | ${at} | ${ok} |`);
    }
    if (rails.length > 200) out.push("", `Showing 200 of ${rails.length} rails.`);
    out.push("");
  }
  const suppressed = designs.flatMap((d) => d.findings).filter((f) => f.suppressed);
  if (suppressed.length > 0) {
    out.push(`<details><summary>${plural2(suppressed.length, "suppressed finding")}</summary>`, "");
    out.push("| rule | parts | reason |", "|---|---|---|");
    for (const f of suppressed.slice(0, Math.min(rowLimit, 200))) {
      out.push(`| \`${f.rule}\` | ${escapeCell(f.parts.join(", ")) || "-"} | ${escapeCell(clip(f.suppressed?.reason ?? "", 300)) || "-"} |`);
    }
    out.push("", "</details>", "");
  }
  if (standing.length === 0 && problems.length === 0) out.push("No findings.", "");
  return out.join("\n");
}
function formatMarkdown(result, options8) {
  const maxBytes = options8.maxBytes ?? SUMMARY_BYTE_LIMIT - 16 * 1024;
  const total = result.designs.reduce((n, d) => n + d.findings.length, 0);
  let rows = Math.min(options8.maxRows ?? 500, total);
  let text = render(result, options8, rows, "");
  if (Buffer.byteLength(text, "utf8") <= maxBytes) return text;
  const note = " (cut to stay under GitHub's 1 MiB job-summary limit)";
  let lo = 0;
  let hi = rows;
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    if (Buffer.byteLength(render(result, options8, mid, note), "utf8") <= maxBytes) lo = mid;
    else hi = mid - 1;
  }
  rows = lo;
  text = render(result, options8, rows, note);
  if (Buffer.byteLength(text, "utf8") <= maxBytes) return text;
  const counts = countBySeverity(result);
  return `## loadline

**${countsText(counts)}**. The summary was too large for GitHub's 1 MiB limit; see the JSON or SARIF report.
`;
}

// src/report/text.ts
function severityLabel(severity, c) {
  const padded = severity.padEnd(7);
  if (severity === "error") return c.red(c.bold(padded));
  if (severity === "warning") return c.yellow(padded);
  return c.cyan(padded);
}
function where3(file, line, column, o) {
  const path = printable(displayPath(file, o));
  return line >= 1 ? `${path}:${line}:${Math.max(1, column)}` : path;
}
function findingLine(f, o) {
  const c = o.colors;
  const parts = f.parts.length > 0 ? ` ${c.bold(printable(f.parts.join(", ")))}` : "";
  const head = `${c.dim(where3(f.file, f.line, f.column, o))}  ${severityLabel(f.severity, c)} ${c.magenta(f.rule)}${parts}`;
  return `    ${head}  ${printable(f.message)}`;
}
function problemLine(p, label, o, paint) {
  return `    ${o.colors.dim(where3(p.file, p.line, p.column, o))}  ${paint(label)} ${printable(p.message)}`;
}
function designSection2(d, o) {
  const c = o.colors;
  const lines = [c.bold(c.underline(printable(displayPath(d.file, o))))];
  for (const p of d.errors) lines.push(problemLine(p, "could not check:", o, (s) => c.red(c.bold(s))));
  const standing = d.findings.filter((f) => !f.suppressed);
  const sheets = /* @__PURE__ */ new Map();
  for (const f of standing) {
    const key = `${f.sheetPath}\0${f.file}`;
    const list2 = sheets.get(key) ?? [];
    list2.push(f);
    sheets.set(key, list2);
  }
  for (const key of [...sheets.keys()].sort(compareText)) {
    const list2 = (sheets.get(key) ?? []).sort(compareFindings);
    const first = list2[0];
    if (!first) continue;
    lines.push(`  ${c.bold(`sheet ${printable(first.sheetPath || "/")}`)} ${c.dim(`(${printable(displayPath(first.file, o))})`)}`);
    for (const f of list2) lines.push(findingLine(f, o));
  }
  const suppressed = d.findings.filter((f) => f.suppressed).sort(compareFindings);
  if (suppressed.length > 0) {
    if (o.showSuppressed) {
      lines.push(`  ${c.dim("suppressed")}`);
      for (const f of suppressed) lines.push(c.dim(`${findingLine(
        f,
        { ...o, colors: noColors }
        /* inner colours would end the dim early */
      )}  [suppressed: ${printable(f.suppressed?.reason ?? "")}]`));
    } else {
      lines.push(`  ${c.dim(`${plural2(suppressed.length, "suppressed finding")} (loadline-ignore fields)`)}`);
    }
  }
  for (const p of d.notes ?? []) lines.push(problemLine(p, "note:", o, c.dim));
  if (standing.length === 0 && d.errors.length === 0) lines.push(`  ${c.green("no findings")}`);
  return lines;
}
function formatText(result, options8) {
  const c = options8.colors;
  const lines = [];
  for (const p of result.errors ?? []) lines.push(problemLine(p, "error:", options8, (s) => c.red(c.bold(s))).trimStart());
  const designs = [...result.designs].sort((a, b) => compareText(a.file, b.file));
  for (const d of designs) {
    lines.push(...designSection2(d, options8), "");
  }
  const counts = countBySeverity(result);
  const failed = result.designs.filter((d) => d.errors.length > 0).length;
  const mark = counts.error > 0 || failed > 0 ? c.red("\u2716") : counts.warning > 0 ? c.yellow("\u26A0") : c.green("\u2714");
  const unread = failed > 0 ? `, ${plural2(failed, "design")} could not be checked` : "";
  lines.push(`${mark} ${countsText(counts)} in ${plural2(designs.length, "design")}${unread} \xB7 band ${bandText2(result.band)}`);
  return `${lines.join("\n")}
`;
}

// src/report/index.ts
var FORMATS = ["text", "json", "sarif", "github", "markdown", "html"];
function isFormat(text) {
  return FORMATS.includes(text);
}
function render2(format, result, options8) {
  const base = { cwd: options8.cwd, root: options8.root };
  switch (format) {
    case "text":
      return formatText(result, { cwd: options8.cwd, root: options8.cwd, colors: options8.colors ?? noColors, showSuppressed: options8.showSuppressed ?? false });
    case "json":
      return formatJson(result, base);
    case "sarif":
      return formatSarif(result, base);
    case "github": {
      const { lines } = formatAnnotations(result, { ...base, overflowPlace: "the JSON or SARIF report" });
      return lines.length > 0 ? `${lines.join("\n")}
` : "";
    }
    case "markdown":
      return formatMarkdown(result, base);
    case "html":
      return formatHtml(result, base);
  }
}

// src/cli/repo-root.ts
import { existsSync } from "node:fs";
import { dirname as dirname7, join as join5, resolve as resolve5 } from "node:path";
function findRepositoryRoot(start, exists2 = existsSync) {
  let dir = resolve5(start);
  for (let depth = 0; depth < 256; depth++) {
    if (exists2(join5(dir, ".git"))) return dir;
    const parent = dirname7(dir);
    if (parent === dir) return void 0;
    dir = parent;
  }
  return void 0;
}

// src/cli/check.ts
function outputCollector() {
  const list2 = [];
  return {
    list: list2,
    format(value) {
      if (!isFormat(value)) throw new InvalidArgumentError(`choose one of ${FORMATS.join(", ")}`);
      list2.push({ format: value });
      return list2;
    },
    output(value) {
      const last = list2.at(-1);
      if (!last || last.file !== void 0) throw new InvalidArgumentError("--output FILE goes right after the --format it is for");
      last.file = value;
      return list2;
    },
    shorthand(format) {
      return (value) => {
        list2.push({ format, file: value });
        return list2;
      };
    }
  };
}
function writeReport(file, text) {
  try {
    mkdirSync(dirname8(resolve6(file)), { recursive: true });
    writeFileSync(file, text);
    return void 0;
  } catch (err) {
    return `cannot write ${file}: ${err instanceof Error ? err.message : String(err)}`;
  }
}
function runCheck(paths, options8, io) {
  const outputs = options8.format.length > 0 ? options8.format : [{ format: "text" }];
  const toStdout = outputs.filter((o) => o.file === void 0);
  if (toStdout.length > 1) {
    io.stderr(`loadline: only one format can go to standard output (${toStdout.map((o) => o.format).join(", ")}); give the others --output FILE
`);
    return 2;
  }
  const result = lint({ paths, ...options8.config !== void 0 ? { configPath: options8.config } : {}, cwd: io.cwd });
  const root = io.env["GITHUB_WORKSPACE"] || findRepositoryRoot(io.cwd) || io.cwd;
  const colorful = options8.color && io.isTTY && !io.env["NO_COLOR"];
  let code = exitCodeFor(result, options8.failOn);
  for (const output of outputs) {
    const text = render2(output.format, result, {
      cwd: io.cwd,
      root,
      colors: createColors(colorful && output.file === void 0),
      showSuppressed: options8.showSuppressed ?? false
    });
    if (output.file === void 0) io.stdout(text);
    else {
      const problem2 = writeReport(resolve6(io.cwd, output.file), text);
      if (problem2) {
        io.stderr(`loadline: ${problem2}
`);
        code = 2;
      }
    }
  }
  return code;
}
function register2(program3) {
  const collect = outputCollector();
  program3.command("check").description("check designs (files, folders or globs; default: the current folder)").argument("[paths...]", "design files (.kicad_sch, .net), folders or globs (default: .)").addOption(new Option("-f, --format <format>", `report format: ${FORMATS.join(", ")} (repeatable)`).argParser((v) => collect.format(v)).default([], "text")).option("-o, --output <file>", "write the preceding --format to FILE instead of standard output", (v) => collect.output(v)).option("--json <file>", "also write the JSON report to FILE", collect.shorthand("json")).option("--sarif <file>", "also write SARIF 2.1.0 to FILE (for code scanning)", collect.shorthand("sarif")).option("--html <file>", "also write the HTML report to FILE", collect.shorthand("html")).option("--markdown <file>", "also write the Markdown summary to FILE", collect.shorthand("markdown")).addOption(new Option("--fail-on <severity>", "exit 1 when a finding is at or above this severity").choices(["error", "warning", "note", "never"]).default("error")).option("-c, --config <file>", "config file (default: the nearest loadline.json above each design)").option("--no-color", "plain text without colours").option("--show-suppressed", "list suppressed findings in the text report, not just their count").action((paths, opts) => {
    const code = runCheck(paths ?? [], { format: collect.list, failOn: opts.failOn, color: opts.color, ...opts.config !== void 0 ? { config: opts.config } : {}, ...opts.showSuppressed ? { showSuppressed: true } : {} }, processIo());
    process.exitCode = code;
  });
}

// src/fix/run.ts
import { relative as relative6, resolve as resolve7, sep as sep2 } from "node:path";

// src/fix/apply.ts
function quoteKicadString(value) {
  let out = '"';
  for (const ch of value) {
    if (ch === "\\") out += "\\\\";
    else if (ch === '"') out += '\\"';
    else if (ch === "\n") out += "\\n";
    else if (ch === "\r") out += "\\r";
    else out += ch;
  }
  return out + '"';
}
function quotedTokenEnd(text, start) {
  if (text[start] !== '"') return void 0;
  for (let i = start + 1; i < text.length; i++) {
    const ch = text[i];
    if (ch === "\\") i++;
    else if (ch === '"') return i + 1;
  }
  return void 0;
}
function editProblem(text, edits) {
  const sorted = sortEdits(edits);
  let previousEnd = -1;
  for (const { span } of sorted) {
    if (!Number.isInteger(span.start) || !Number.isInteger(span.end) || span.start < 0 || span.end > text.length) {
      return `characters ${span.start}-${span.end} lie outside the file (${text.length} characters)`;
    }
    if (span.start < previousEnd) return `edits at characters ${span.start} and before ${previousEnd} overlap`;
    if (quotedTokenEnd(text, span.start) !== span.end) {
      return `characters ${span.start}-${span.end} are not one quoted string (found ${JSON.stringify(text.slice(span.start, Math.min(span.end, span.start + 40)))})`;
    }
    previousEnd = span.end;
  }
  return void 0;
}
function applyEdits(text, edits) {
  const problem2 = editProblem(text, edits);
  if (problem2 !== void 0) throw new RangeError(`applyEdits: ${problem2}`);
  let out = "";
  let cursor = 0;
  for (const edit of sortEdits(edits)) {
    out += text.slice(cursor, edit.span.start) + quoteKicadString(edit.replacement);
    cursor = edit.span.end;
  }
  return out + text.slice(cursor);
}
function decodeForEditing(bytes) {
  const buffer = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const text = buffer.toString("utf8");
  if (!Buffer.from(text, "utf8").equals(buffer)) {
    return { ok: false, problem: "the file is not valid UTF-8, so it cannot be edited without changing other bytes" };
  }
  return { ok: true, text };
}
function applyEditsToBytes(bytes, edits) {
  const decoded = decodeForEditing(bytes);
  if (!decoded.ok) return decoded;
  const { text } = decoded;
  const problem2 = editProblem(text, edits);
  if (problem2 !== void 0) return { ok: false, problem: problem2 };
  const source = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const pieces = [];
  let charCursor = 0;
  let byteCursor = 0;
  for (const edit of sortEdits(edits)) {
    const byteStart = byteCursor + Buffer.byteLength(text.slice(charCursor, edit.span.start), "utf8");
    const byteEnd = byteStart + Buffer.byteLength(text.slice(edit.span.start, edit.span.end), "utf8");
    pieces.push(source.subarray(byteCursor, byteStart), Buffer.from(quoteKicadString(edit.replacement), "utf8"));
    charCursor = edit.span.end;
    byteCursor = byteEnd;
  }
  pieces.push(source.subarray(byteCursor));
  return { ok: true, bytes: Buffer.concat(pieces) };
}
function sortEdits(edits) {
  return [...edits].sort((a, b) => a.span.start - b.span.start || a.span.end - b.span.end);
}

// src/fix/plan.ts
var naturalOrder = new Intl.Collator("en", { numeric: true }).compare;
function spanKey(span) {
  return `${span.file}\0${span.start}\0${span.end}`;
}
function planFixes(designs, options8 = {}) {
  const show = options8.displayPath ?? ((file) => file);
  const ruleFilter = options8.rules !== void 0 && options8.rules.length > 0 ? new Set(options8.rules) : void 0;
  const holders = /* @__PURE__ */ new Map();
  designs.forEach((design2, index) => {
    for (const part of design2.parts) {
      if (part.valueSpan === void 0) continue;
      const key = spanKey(part.valueSpan);
      const list2 = holders.get(key) ?? [];
      list2.push({ design: index, part });
      holders.set(key, list2);
    }
  });
  const groups = /* @__PURE__ */ new Map();
  designs.forEach((design2, index) => {
    for (const finding3 of design2.findings) {
      const fix = finding3.fix;
      if (fix === void 0 || ruleFilter !== void 0 && !ruleFilter.has(finding3.rule)) continue;
      const key = spanKey(fix.span);
      const group = groups.get(key) ?? { span: fix.span, wishes: [], suppressed: [] };
      groups.set(key, group);
      const holder = holderOf(holders.get(key) ?? [], index, finding3);
      const wish = {
        design: index,
        ref: holder?.part.ref ?? finding3.parts[0] ?? "(unnamed part)",
        sheetPath: holder?.part.origin.sheetPath ?? finding3.sheetPath,
        rule: finding3.rule,
        replacement: fix.replacement,
        finding: finding3
      };
      (finding3.suppressed === void 0 ? group.wishes : group.suppressed).push(wish);
    }
  });
  const accepted = [];
  const refused = [];
  for (const [key, group] of groups) {
    if (group.wishes.length === 0) continue;
    const decision = decide(group, holders.get(key) ?? [], show);
    if ("reason" in decision) refused.push(decision);
    else accepted.push(decision);
  }
  const byFile = /* @__PURE__ */ new Map();
  for (const edit of accepted) {
    const list2 = byFile.get(edit.span.file) ?? [];
    list2.push(edit);
    byFile.set(edit.span.file, list2);
  }
  const files = [];
  for (const [file, edits] of [...byFile].sort(([a], [b]) => naturalOrder(a, b))) {
    edits.sort((a, b) => a.span.start - b.span.start || a.span.end - b.span.end);
    const overlapping = /* @__PURE__ */ new Set();
    for (let i = 1; i < edits.length; i++) {
      const previous = edits[i - 1];
      const current = edits[i];
      if (previous !== void 0 && current !== void 0 && current.span.start < previous.span.end) {
        overlapping.add(previous).add(current);
      }
    }
    for (const edit of overlapping) {
      const others = [...overlapping].filter((o) => o !== edit).flatMap((o) => o.refs);
      refused.push({
        span: edit.span,
        refs: edit.refs,
        rules: edit.rules,
        wishes: edit.wishes,
        reason: `${edit.refs.join("/")}: the edit overlaps another edit in ${show(file)} (${others.join("/")}); neither is made`
      });
    }
    const kept = edits.filter((e) => !overlapping.has(e));
    if (kept.length > 0) files.push({ file, edits: kept });
  }
  refused.sort((a, b) => naturalOrder(a.span.file, b.span.file) || a.span.start - b.span.start);
  return { files, refused };
}
function holderOf(holders, design2, finding3) {
  const inDesign = holders.filter((h) => h.design === design2);
  return inDesign.find((h) => finding3.parts.includes(h.part.ref)) ?? inDesign.find((h) => h.part.origin.sheetPath === finding3.sheetPath) ?? (inDesign.length === 1 ? inDesign[0] : void 0);
}
function instanceKey(design2, ref) {
  return `${design2}\0${ref}`;
}
function decide(group, holders, show) {
  const file = show(group.span.file);
  const wishes = group.wishes;
  const rules = unique(wishes.map((w) => w.rule));
  const asking = new Set(wishes.map((w) => instanceKey(w.design, w.ref)));
  const instances = /* @__PURE__ */ new Map();
  for (const h of holders) instances.set(instanceKey(h.design, h.part.ref), { ref: h.part.ref, sheetPath: h.part.origin.sheetPath, design: h.design });
  for (const w of wishes) if (!instances.has(instanceKey(w.design, w.ref))) instances.set(instanceKey(w.design, w.ref), { ref: w.ref, sheetPath: w.sheetPath, design: w.design });
  const sortedInstances = [...instances.values()].sort((a, b) => naturalOrder(a.ref, b.ref) || naturalOrder(a.sheetPath, b.sheetPath));
  const refs = unique(sortedInstances.map((i) => i.ref));
  const sheetPaths = unique(sortedInstances.map((i) => i.sheetPath));
  const shared = sortedInstances.length > 1;
  const oldValue = holders[0]?.part.value ?? "";
  const refuse = (reason) => ({ span: group.span, refs, rules, wishes, reason });
  const sharePrefix = `${refs.join("/")} share one value in ${file}`;
  const wishText = (w) => `${w.ref} (${w.sheetPath}) wants ${w.replacement}` + (rules.length > 1 ? ` [${w.rule}]` : "");
  const silent = sortedInstances.filter((i) => !asking.has(instanceKey(i.design, i.ref)));
  if (silent.length > 0) {
    const why = silent.map((i) => {
      const muted = group.suppressed.some((s) => s.design === i.design && s.ref === i.ref);
      return `${i.ref} (${i.sheetPath}) ${muted ? "has its finding suppressed" : "has no fix for it"}`;
    });
    return refuse(`${sharePrefix}; ${wishes.map(wishText).join(", ")}, but ${why.join(", ")}: not changed`);
  }
  const replacements = unique(wishes.map((w) => w.replacement));
  if (replacements.length > 1) {
    const lead = shared ? sharePrefix : `${refs.join("/")} in ${file}`;
    return refuse(`${lead}; ${wishes.map(wishText).join(", ")}: not changed`);
  }
  const replacement = replacements[0] ?? "";
  if (holders.length > 0 && holders.every((h) => h.part.value === replacement)) {
    return refuse(`${refs.join("/")} in ${file}: the fix would write the value it already has (${replacement}); not changed`);
  }
  const first = wishes[0];
  const description = shared ? `${refs.join("/")} ${oldValue} -> ${replacement} (one value in ${file}, shared by ${sheetPaths.join(", ")}; right for every instance)` : first?.finding.fix?.description ?? `${refs.join("/")} ${oldValue} -> ${replacement}`;
  return { span: group.span, replacement, oldValue, refs, sheetPaths, rules, description, wishes };
}
function unique(values) {
  return [...new Set(values)];
}

// src/fix/sources.ts
function snapshotSource(inner) {
  const seen = /* @__PURE__ */ new Map();
  const keyOf = (path) => {
    const real = inner.realpath(path);
    return typeof real === "string" ? real : void 0;
  };
  const source = {
    read(path) {
      const key = keyOf(path) ?? path;
      const known = seen.get(key);
      if (known !== void 0) return known;
      const data = inner.read(path);
      if (Buffer.isBuffer(data)) seen.set(key, Buffer.from(data));
      return data;
    },
    realpath: (path) => inner.realpath(path),
    size(path) {
      const known = seen.get(keyOf(path) ?? path);
      if (known !== void 0) return known.length;
      return inner.size ? inner.size(path) : sizeByReading(inner, path);
    }
  };
  return {
    source,
    keyOf,
    bytesOf(path) {
      const key = keyOf(path);
      return key === void 0 ? void 0 : seen.get(key);
    }
  };
}
function overlaySource(base, replaced) {
  const keyOf = (path) => {
    const real = base.realpath(path);
    return typeof real === "string" ? real : path;
  };
  return {
    read(path) {
      return replaced.get(keyOf(path)) ?? base.read(path);
    },
    realpath: (path) => base.realpath(path),
    size(path) {
      const bytes = replaced.get(keyOf(path));
      if (bytes !== void 0) return bytes.length;
      return base.size ? base.size(path) : sizeByReading(base, path);
    }
  };
}
function sizeByReading(source, path) {
  const data = source.read(path);
  return Buffer.isBuffer(data) ? data.length : data;
}

// src/fix/unified-diff.ts
function unifiedDiff(path, oldText, edits, options8 = {}) {
  const context = options8.context ?? 3;
  const lineStarts = lineStartOffsets(oldText);
  const lineCount = lineStarts.length - 1;
  const blocks = changeBlocks(oldText, lineStarts, edits);
  if (blocks.length === 0) return "";
  let out = `--- a/${path}
+++ b/${path}
`;
  let lineDelta = 0;
  let index = 0;
  while (index < blocks.length) {
    let end = index;
    while (end + 1 < blocks.length && blockAt(blocks, end + 1).first - blockAt(blocks, end).last - 1 <= 2 * context) end++;
    const firstBlock = blockAt(blocks, index);
    const lastBlock = blockAt(blocks, end);
    const hunkFirst = Math.max(0, firstBlock.first - context);
    const hunkLast = Math.min(lineCount - 1, lastBlock.last + context);
    const body = [];
    let oldCount = 0;
    let newCount = 0;
    let line = hunkFirst;
    let hunkDelta = 0;
    for (let b = index; b <= end; b++) {
      const block = blockAt(blocks, b);
      for (; line < block.first; line++, oldCount++, newCount++) body.push(diffLine(" ", lineText(oldText, lineStarts, line)));
      for (; line <= block.last; line++, oldCount++) body.push(diffLine("-", lineText(oldText, lineStarts, line)));
      for (const added of block.newLines) body.push(diffLine("+", added));
      newCount += block.newLines.length;
      hunkDelta += block.newLines.length - (block.last - block.first + 1);
    }
    for (; line <= hunkLast; line++, oldCount++, newCount++) body.push(diffLine(" ", lineText(oldText, lineStarts, line)));
    const newFirst = hunkFirst + lineDelta;
    out += `@@ -${rangeText(hunkFirst, oldCount)} +${rangeText(newFirst, newCount)} @@
${body.join("")}`;
    lineDelta += hunkDelta;
    index = end + 1;
  }
  return out;
}
function lineStartOffsets(text) {
  const starts = [0];
  for (let i = text.indexOf("\n"); i !== -1; i = text.indexOf("\n", i + 1)) starts.push(i + 1);
  if (starts[starts.length - 1] !== text.length) starts.push(text.length);
  return starts;
}
function changeBlocks(text, lineStarts, edits) {
  const sorted = [...edits].sort((a, b) => a.span.start - b.span.start);
  const groups = [];
  for (const edit of sorted) {
    const first = lineIndexOf(lineStarts, edit.span.start);
    const last = lineIndexOf(lineStarts, Math.max(edit.span.start, edit.span.end - 1));
    const previous = groups[groups.length - 1];
    if (previous !== void 0 && first <= previous.last) {
      previous.last = Math.max(previous.last, last);
      previous.edits.push(edit);
    } else {
      groups.push({ first, last, edits: [edit] });
    }
  }
  const blocks = [];
  for (const group of groups) {
    const from = lineStarts[group.first] ?? 0;
    const to = lineStarts[group.last + 1] ?? text.length;
    const oldBlock = text.slice(from, to);
    const shifted = group.edits.map((e) => ({ span: { start: e.span.start - from, end: e.span.end - from }, replacement: e.replacement }));
    const newBlock = applyEdits(oldBlock, shifted);
    if (newBlock !== oldBlock) blocks.push({ first: group.first, last: group.last, newLines: splitKeepingNewlines(newBlock) });
  }
  return blocks;
}
function lineIndexOf(lineStarts, offset) {
  let low = 0;
  let high = lineStarts.length - 2;
  while (low < high) {
    const mid = low + high + 1 >> 1;
    if ((lineStarts[mid] ?? 0) <= offset) low = mid;
    else high = mid - 1;
  }
  return Math.max(0, low);
}
function lineText(text, lineStarts, line) {
  return text.slice(lineStarts[line] ?? text.length, lineStarts[line + 1] ?? text.length);
}
function splitKeepingNewlines(text) {
  const lines = [];
  let start = 0;
  for (let i = text.indexOf("\n"); i !== -1; i = text.indexOf("\n", i + 1)) {
    lines.push(text.slice(start, i + 1));
    start = i + 1;
  }
  if (start < text.length) lines.push(text.slice(start));
  return lines;
}
function diffLine(prefix, line) {
  return line.endsWith("\n") ? prefix + line : `${prefix}${line}
\\ No newline at end of file
`;
}
function rangeText(firstIndex, count) {
  if (count === 0) return `${firstIndex},0`;
  return count === 1 ? `${firstIndex + 1}` : `${firstIndex + 1},${count}`;
}
function blockAt(blocks, index) {
  const block = blocks[index];
  if (block === void 0) throw new RangeError(`unifiedDiff: no change block ${index}`);
  return block;
}

// src/fix/verify.ts
var MAX_LISTED = 3;
function netDifference(before, after) {
  const beforeNets = netMembership(before);
  const afterNets = netMembership(after);
  const problems = [];
  for (const [name, pins] of beforeNets) {
    const now = afterNets.get(name);
    if (now === void 0) problems.push(`net ${name} is gone`);
    else if (now !== pins) problems.push(`net ${name} has other pins (${pins || "none"} before, ${now || "none"} after)`);
  }
  for (const name of afterNets.keys()) if (!beforeNets.has(name)) problems.push(`net ${name} is new`);
  return summarise(problems);
}
function partDifference(before, after, expected) {
  const wanted = new Map(expected.map((e) => [e.ref, e.value]));
  const afterParts = new Map(after.parts.map((p) => [p.ref, p]));
  const problems = [];
  for (const part of before.parts) {
    const now = afterParts.get(part.ref);
    if (now === void 0) {
      problems.push(`${part.ref} is gone`);
      continue;
    }
    const value = wanted.get(part.ref) ?? part.value;
    if (now.value !== value) problems.push(`${part.ref} reads back as ${JSON.stringify(now.value)}, not ${JSON.stringify(value)}`);
    const changed = changedAspect(part, now);
    if (changed !== void 0) problems.push(`${part.ref}'s ${changed} changed`);
  }
  const beforeRefs = new Set(before.parts.map((p) => p.ref));
  for (const part of after.parts) if (!beforeRefs.has(part.ref)) problems.push(`${part.ref} is new`);
  return summarise(problems);
}
function findingDifference(before, after, gone) {
  const standing = (list2) => list2.filter((f) => f.suppressed === void 0);
  const beforeKeys = new Set(standing(before).map(findingKey));
  const problems = [];
  for (const finding3 of standing(after)) {
    const remaining = gone.find((g) => g.rule === finding3.rule && finding3.parts.includes(g.ref));
    if (remaining !== void 0) problems.push(`${finding3.rule} still reports ${remaining.ref}: ${finding3.message}`);
    else if (!beforeKeys.has(findingKey(finding3))) problems.push(`the change brings a new ${finding3.severity} (${finding3.rule}): ${finding3.message}`);
  }
  return summarise(problems);
}
function netMembership(circuit) {
  const nets = /* @__PURE__ */ new Map();
  for (const net of circuit.nets) {
    const pins = net.pins.map((p) => `${p.ref}.${p.pin}`).sort();
    nets.set(net.name, pins.join(" "));
  }
  return nets;
}
function changedAspect(before, after) {
  if (before.kind !== after.kind) return "kind";
  if (before.libId !== after.libId) return "library symbol";
  if (before.footprint !== after.footprint) return "footprint";
  if (before.dnp !== after.dnp || before.excludedFromSim !== after.excludedFromSim) return "flags";
  if (!sameRecord(before.pins, after.pins)) return "pin connections";
  if (!sameRecord(before.fields, after.fields)) return "fields";
  return void 0;
}
function sameRecord(a, b) {
  const keys = Object.keys(a);
  return keys.length === Object.keys(b).length && keys.every((k) => Object.hasOwn(b, k) && a[k] === b[k]);
}
function findingKey(finding3) {
  return `${finding3.rule}\0${finding3.sheetPath}\0${[...finding3.parts].sort().join(",")}`;
}
function summarise(problems) {
  if (problems.length === 0) return void 0;
  const shown3 = problems.slice(0, MAX_LISTED).join("; ");
  return problems.length > MAX_LISTED ? `${shown3}; and ${problems.length - MAX_LISTED} more` : shown3;
}

// src/fix/write.ts
import * as nodeFs from "node:fs";
import { randomBytes } from "node:crypto";
import { basename as basename2, dirname as dirname9, join as join6 } from "node:path";
function nodeWriteFs() {
  return {
    readFileSync: (path) => nodeFs.readFileSync(path),
    statSync: (path) => nodeFs.statSync(path),
    realpathSync: (path) => nodeFs.realpathSync(path),
    openSync: (path, flags, mode) => nodeFs.openSync(path, flags, mode),
    writeSync: (fd, buffer, offset, length) => nodeFs.writeSync(fd, buffer, offset, length),
    fsyncSync: (fd) => nodeFs.fsyncSync(fd),
    fchmodSync: (fd, mode) => nodeFs.fchmodSync(fd, mode),
    closeSync: (fd) => nodeFs.closeSync(fd),
    renameSync: (from, to) => nodeFs.renameSync(from, to),
    unlinkSync: (path) => nodeFs.unlinkSync(path)
  };
}
var MAX_STALLED_WRITES = 8;
function replaceFileAtomically(path, expected, next, fs = nodeWriteFs(), name = path) {
  let target;
  let mode;
  try {
    target = fs.realpathSync(path);
    if (!sameBytes(fs.readFileSync(target), expected)) return { ok: false, reason: `${name} changed since it was checked; not written (run fix again)` };
    mode = fs.statSync(target).mode & 4095;
  } catch (err) {
    return { ok: false, reason: `${name} could not be read again before writing (${errorText(err)}); not written` };
  }
  const temp = join6(dirname9(target), `.${basename2(target)}.loadline-${process.pid}-${randomBytes(4).toString("hex")}.tmp`);
  let created = false;
  try {
    const fd = fs.openSync(temp, "wx", 384);
    created = true;
    try {
      writeAll(fs, fd, next);
      fs.fchmodSync(fd, mode);
      fs.fsyncSync(fd);
    } finally {
      fs.closeSync(fd);
    }
    if (!sameBytes(fs.readFileSync(target), expected)) {
      removeQuietly(fs, temp);
      return { ok: false, reason: `${name} changed while the fix was being written; not written (run fix again)` };
    }
    fs.renameSync(temp, target);
  } catch (err) {
    if (created) removeQuietly(fs, temp);
    return { ok: false, reason: `${name} could not be written (${errorText(err)}); the original is unchanged` };
  }
  syncFolderQuietly(fs, dirname9(target));
  return { ok: true, path: target };
}
function writeAll(fs, fd, bytes) {
  let offset = 0;
  let stalled = 0;
  while (offset < bytes.length) {
    const written = fs.writeSync(fd, bytes, offset, bytes.length - offset);
    if (written > 0) {
      offset += written;
      stalled = 0;
    } else if (++stalled >= MAX_STALLED_WRITES) {
      throw new Error(`the write made no progress at byte ${offset} of ${bytes.length}`);
    }
  }
}
function syncFolderQuietly(fs, folder) {
  try {
    const fd = fs.openSync(folder, "r");
    try {
      fs.fsyncSync(fd);
    } finally {
      fs.closeSync(fd);
    }
  } catch {
  }
}
function removeQuietly(fs, path) {
  try {
    fs.unlinkSync(path);
  } catch {
  }
}
function sameBytes(a, b) {
  return Buffer.from(a.buffer, a.byteOffset, a.byteLength).equals(b);
}
function errorText(err) {
  if (err instanceof Error) {
    const code = err.code;
    return code !== void 0 ? `${code}: ${err.message}` : err.message;
  }
  return String(err);
}

// src/fix/run.ts
function fixExitCode(report) {
  if (report.errors.length > 0) return 2;
  return report.refused.length > 0 ? 1 : 0;
}
function runFix(request) {
  const cwd = request.cwd ?? process.cwd();
  const inner = request.source ?? nodeFileSource();
  const writeFs = request.writeFs ?? nodeWriteFs();
  const display = (file) => displayPath2(cwd, file);
  const dryRun = request.dryRun ?? false;
  const report = { files: [], refused: [], errors: [], dryRun };
  const refuse = (edits, reason) => {
    for (const e of edits) report.refused.push({ file: e.file, display: display(e.file), refs: e.refs, rules: e.rules, reason });
  };
  const snapshot = snapshotSource(inner);
  const lintWith = (fs, paths, lister) => lint({
    paths: paths.map((p) => resolve7(p)),
    fs,
    lister: lister ?? filesOnly,
    ...request.configPath !== void 0 ? { configPath: request.configPath } : {},
    ...request.lintRules !== void 0 ? { rules: request.lintRules } : {}
  });
  const before = lintWith(snapshot.source, request.paths.map((p) => resolve7(cwd, p)), request.lister ?? (request.source === void 0 ? nodePathLister() : void 0));
  if (hasRunErrors(before)) {
    report.errors.push(...[...before.errors ?? [], ...before.designs.flatMap((d) => d.errors)].map((e) => ({ ...e, file: display(e.file) })));
    return report;
  }
  const known = new Set((before.rules ?? []).map((r) => r.id));
  const unknown = (request.rules ?? []).filter((id) => !known.has(id));
  if (unknown.length > 0) {
    const list2 = [...known].sort().join(", ");
    report.errors.push({ file: "", line: 0, column: 0, message: `--rule ${unknown.join(", ")}: no such rule (rules: ${list2})` });
    return report;
  }
  const baseline = { designs: before.designs, circuits: /* @__PURE__ */ new Map() };
  const planDesigns = [];
  for (const design2 of before.designs) {
    const read = readDesign(design2.file, { fs: snapshot.source });
    if (!read.ok) {
      report.errors.push({ file: display(read.error.file), line: read.error.line, column: read.error.column, message: read.error.message });
      continue;
    }
    baseline.circuits.set(design2.file, read.circuit);
    planDesigns.push({ parts: read.circuit.parts, findings: design2.findings });
  }
  if (report.errors.length > 0) return report;
  const plan = planFixes(planDesigns, { ...request.rules !== void 0 ? { rules: request.rules } : {}, displayPath: display });
  for (const r of plan.refused) report.refused.push({ file: r.span.file, display: display(r.span.file), refs: r.refs, rules: r.rules, reason: r.reason });
  let candidates3 = [];
  for (const filePlan of plan.files) {
    const edits = filePlan.edits.map((e) => ({ ...e, file: filePlan.file }));
    const bytes = bytesFor(snapshot, edits);
    if (typeof bytes === "string") refuse(edits, `${display(filePlan.file)}: ${bytes}; not changed`);
    else candidates3.push(...edits);
  }
  if (candidates3.length === 0) return finish(report);
  const checkInMemory = (edits) => {
    const files2 = filesFor(snapshot, edits);
    if (typeof files2 === "string") return files2;
    const replaced = new Map(files2.map((f) => [f.key, f.next]));
    return checkDesign2(overlaySource(snapshot.source, replaced), edits, files2, baseline, snapshot, lintWith);
  };
  candidates3 = isolate(candidates3, checkInMemory, refuse);
  if (candidates3.length === 0) return finish(report);
  const files = filesFor(snapshot, candidates3);
  if (typeof files === "string") {
    refuse(candidates3, files);
    return finish(report);
  }
  if (dryRun) {
    for (const f of files) report.files.push({ file: f.file, display: display(f.file), edits: f.edits, diff: unifiedDiff(display(f.file), f.text, f.edits), written: false });
    return finish(report);
  }
  const written = [];
  for (const f of files) {
    const outcome = replaceFileAtomically(f.file, f.original, f.next, writeFs, display(f.file));
    if (outcome.ok) {
      written.push(f);
      continue;
    }
    refuse(f.edits, outcome.reason);
    for (const done of written) refuse(done.edits, `${display(done.file)}: undone, because writing ${display(f.file)} failed (${restore(done, writeFs, display)})`);
    for (const rest of files.slice(files.indexOf(f) + 1)) refuse(rest.edits, `${display(rest.file)}: not written, because writing ${display(f.file)} failed`);
    return finish(report);
  }
  const fresh = snapshotSource(inner);
  const onDisk = files.filter((f) => {
    const data = fresh.source.read(f.file);
    return Buffer.isBuffer(data) && data.equals(f.next);
  });
  let doubt = onDisk.length === files.length ? checkDesign2(fresh.source, candidates3, files, baseline, fresh, lintWith) : void 0;
  if (onDisk.length !== files.length) {
    const changed = files.filter((f) => !onDisk.includes(f)).map((f) => display(f.file));
    doubt = `after writing, ${changed.join(", ")} did not read back as written (changed by someone else?)`;
  }
  if (doubt !== void 0) {
    for (const f of files) {
      const undo = onDisk.includes(f) ? restore(f, writeFs, display) : "left as it is now";
      refuse(f.edits, `${display(f.file)}: written, but re-reading it showed ${doubt}; ${undo}`);
    }
    return finish(report);
  }
  for (const f of files) report.files.push({ file: f.file, display: display(f.file), edits: f.edits, diff: unifiedDiff(display(f.file), f.text, f.edits), written: true });
  return finish(report);
}
var filesOnly = { kind: () => "file", list: () => ({ error: "folders cannot be listed here" }) };
function finish(report) {
  report.refused.sort((a, b) => a.display < b.display ? -1 : a.display > b.display ? 1 : 0);
  return report;
}
function isolate(edits, check, refuse) {
  const together = check(edits);
  if (together === void 0) return edits;
  if (edits.length === 1) {
    refuse(edits, `${edits[0]?.refs.join("/")}: not changed, because with the change ${together}`);
    return [];
  }
  const survivors = [];
  for (const edit of edits) {
    const alone = check([edit]);
    if (alone === void 0) survivors.push(edit);
    else refuse([edit], `${edit.refs.join("/")}: not changed, because with the change ${alone}`);
  }
  if (survivors.length === 0) return [];
  const rest = survivors.length === edits.length ? together : check(survivors);
  if (rest === void 0) return survivors;
  refuse(survivors, `${survivors.flatMap((e) => e.refs).join(", ")}: each change passes alone, but together ${rest}; none of them made`);
  return [];
}
function bytesFor(snapshot, edits) {
  const first = edits[0];
  if (first === void 0) return "no edits";
  const key = snapshot.keyOf(first.file);
  const original = snapshot.bytesOf(first.file);
  if (key === void 0 || original === void 0) return "the file was not read during the check";
  const decoded = decodeForEditing(original);
  if (!decoded.ok) return decoded.problem;
  const applied = applyEditsToBytes(original, edits);
  if (!applied.ok) return `the edits do not fit the file as it was read (${applied.problem})`;
  return { file: first.file, key, original, next: applied.bytes, text: decoded.text, edits: [...edits] };
}
function filesFor(snapshot, edits) {
  const byFile = /* @__PURE__ */ new Map();
  for (const e of edits) byFile.set(e.file, [...byFile.get(e.file) ?? [], e]);
  const out = [];
  for (const group of byFile.values()) {
    const bytes = bytesFor(snapshot, group);
    if (typeof bytes === "string") return bytes;
    out.push(bytes);
  }
  return out;
}
function checkDesign2(source, edits, files, baseline, keys, lintWith) {
  const changedKeys = new Set(files.map((f) => f.key));
  const touched = baseline.designs.map((design2, index) => ({ design: design2, index })).filter(({ design: design2 }) => design2.sheetFiles.some((f) => changedKeys.has(keys.keyOf(f) ?? f)));
  for (const { design: design2, index } of touched) {
    const before = baseline.circuits.get(design2.file);
    if (before === void 0) return `${design2.file} has no baseline to compare with`;
    const read = readDesign(design2.file, { fs: source });
    if (!read.ok) return `${read.error.file} no longer reads (${read.error.message})`;
    const expected = edits.flatMap((e) => e.wishes.filter((w) => w.design === index).map((w) => ({ ref: w.ref, value: e.replacement })));
    const problem2 = netDifference(before, read.circuit) ?? partDifference(before, read.circuit, expected);
    if (problem2 !== void 0) return problem2;
  }
  const after = lintWith(source, touched.map((t) => t.design.file));
  if (hasRunErrors(after)) {
    const first = after.errors?.[0] ?? after.designs.flatMap((d) => d.errors)[0];
    return `the check fails on the edited design (${first?.message ?? "unknown error"})`;
  }
  for (const { design: design2, index } of touched) {
    const now = after.designs.find((d) => resolve7(d.file) === resolve7(design2.file));
    if (now === void 0) return `${design2.file} was not checked again`;
    const gone = edits.flatMap((e) => e.wishes.filter((w) => w.design === index).map((w) => ({ rule: w.rule, ref: w.ref })));
    const problem2 = findingDifference(design2.findings, now.findings, gone);
    if (problem2 !== void 0) return problem2;
  }
  return void 0;
}
function restore(file, writeFs, display) {
  const outcome = replaceFileAtomically(file.file, file.next, file.original, writeFs, display(file.file));
  return outcome.ok ? "the original was restored" : `the original could NOT be restored (${outcome.reason}); check ${display(file.file)} by hand`;
}
function displayPath2(cwd, file) {
  const absolute = resolve7(file);
  const rel = relative6(cwd, absolute);
  const shown3 = rel === "" || rel === ".." || rel.startsWith(`..${sep2}`) ? absolute : rel;
  return sep2 === "/" ? shown3 : shown3.split(sep2).join("/");
}

// src/cli/fix.ts
function runFixCommand(paths, options8, io, request = {}) {
  const report = runFix({
    paths: paths.length > 0 ? paths : ["."],
    cwd: io.cwd,
    dryRun: options8.dryRun,
    ...options8.rule.length > 0 ? { rules: options8.rule } : {},
    ...options8.config !== void 0 ? { configPath: options8.config } : {},
    ...request
  });
  const colors = createColors(options8.color && io.isTTY && !io.env["NO_COLOR"]);
  if (report.errors.length > 0) {
    for (const e of report.errors) io.stderr(`${place(e)}${e.message}
`);
    io.stderr(`loadline fix: the check failed, so nothing was changed
`);
    return 2;
  }
  if (options8.dryRun) {
    for (const file of report.files) io.stdout(file.diff);
    io.stderr(describe(report, colors));
  } else {
    io.stdout(describe(report, colors));
  }
  return fixExitCode(report);
}
function place(e) {
  if (e.file === "") return "loadline fix: ";
  return e.line > 0 ? `${e.file}:${e.line}:${e.column}: ` : `${e.file}: `;
}
function describe(report, colors) {
  const lines = [];
  const verb = report.dryRun ? "would change" : "changed";
  for (const file of report.files) {
    lines.push(colors.bold(file.display));
    for (const edit of file.edits) lines.push(`  ${colors.green(verb)} ${edit.description}`);
  }
  if (report.refused.length > 0) {
    lines.push(colors.bold("not changed"));
    for (const r of report.refused) lines.push(`  ${colors.yellow("refused")} ${r.reason}`);
  }
  const values = report.files.reduce((n, f) => n + f.edits.length, 0);
  if (values === 0 && report.refused.length === 0) lines.push("nothing to fix");
  else {
    const done = values === 0 ? `nothing ${report.dryRun ? "would change" : "changed"}` : `${values} ${values === 1 ? "value" : "values"} ${verb} in ${report.files.length} ${report.files.length === 1 ? "file" : "files"}`;
    const refused = report.refused.length > 0 ? `; ${report.refused.length} ${report.refused.length === 1 ? "fix" : "fixes"} refused` : "";
    lines.push(`${done}${refused}${report.dryRun ? " (dry run: nothing written)" : ""}`);
  }
  return lines.join("\n") + "\n";
}
function register3(program3) {
  program3.command("fix").description("make the value changes the checks propose, in the schematic files (atomic, verified)").argument("[paths...]", "design files (.kicad_sch), folders or globs (default: the current folder)").option("-r, --rule <id>", "only fixes from this rule (repeatable)", (value, previous) => [...previous ?? [], value]).option("-n, --dry-run", "print a unified diff of the changes instead of writing them").option("-c, --config <file>", "config file (default: the nearest loadline.json above each design)").option("--no-color", "plain text without colours").addHelpText(
    "after",
    "\nOnly Value strings change; each change is checked (same nets, the finding gone, no new finding)\nbefore and after it is written. Review the diff before you build: a value the checks accept can\nstill be wrong for power, voltage or safety ratings the schematic does not state."
  ).action((paths, opts) => {
    const code = runFixCommand(paths ?? [], { rule: opts.rule ?? [], dryRun: opts.dryRun ?? false, color: opts.color, ...opts.config !== void 0 ? { config: opts.config } : {} }, processIo());
    process.exitCode = code;
  });
}

// src/cli/init.ts
import { writeFileSync as writeFileSync2 } from "node:fs";
import { join as join7 } from "node:path";
var RAIL_PLACEHOLDER = "set me, e.g. 12V";
function starterConfig(rails) {
  const config = {
    band: { low: si2(DEFAULTS.band.low, "Hz").replace(" ", ""), high: si2(DEFAULTS.band.high, "Hz").replace(" ", "") },
    rails: Object.fromEntries([...new Set(rails)].sort().map((r) => [r, RAIL_PLACEHOLDER])),
    swing: `${DEFAULTS.swingVolts}V`,
    rules: {},
    ignore: [],
    series: { ...DEFAULTS.series }
  };
  return `${JSON.stringify(config, null, 2)}
`;
}
function railsNeedingVoltage(cwd) {
  const fs = nodeFileSource();
  const { files, problems } = expandPaths(["."], nodePathLister(), cwd);
  const schematics = files.map((f) => join7(cwd, f.path)).filter((p) => p.endsWith(".kicad_sch"));
  const netlists = files.map((f) => join7(cwd, f.path)).filter((p) => p.endsWith(".net"));
  const sheets = findRootSheets(schematics, fs);
  const roots = [...sheets.roots, ...netlists];
  const rails = [];
  const messages = [
    ...problems.map((p) => `${p.file}: ${p.message}`),
    ...sheets.errors.map((e) => `${e.file}:${e.line}:${e.column}: ${e.message}`)
  ];
  for (const root of roots) {
    const read = readDesign(root, { fs });
    if (!read.ok) {
      messages.push(`${read.error.file}:${read.error.line}:${read.error.column}: ${read.error.message}`);
      continue;
    }
    rails.push(...createContext(read.circuit, defaultConfig()).unresolvedRails());
  }
  return { rails, designs: roots, problems: messages };
}
function register4(program3) {
  program3.command("init").description(`write a starter ${CONFIG_FILE_NAME} for the design in the current folder`).action(() => {
    const cwd = process.cwd();
    const target = join7(cwd, CONFIG_FILE_NAME);
    const found = railsNeedingVoltage(cwd);
    for (const p of found.problems) process.stderr.write(`loadline: ${p}
`);
    try {
      writeFileSync2(target, starterConfig(found.rails), { flag: "wx" });
    } catch (err) {
      const exists2 = typeof err === "object" && err !== null && "code" in err && err.code === "EEXIST";
      process.stderr.write(exists2 ? `loadline: ${CONFIG_FILE_NAME} already exists here; edit it, or remove it first
` : `loadline: cannot write ${CONFIG_FILE_NAME}: ${err instanceof Error ? err.message : String(err)}
`);
      process.exitCode = 2;
      return;
    }
    process.stdout.write(`wrote ${CONFIG_FILE_NAME} for ${found.designs.length} design(s)
`);
    if (found.rails.length > 0) process.stdout.write(`set the voltage of ${[...new Set(found.rails)].sort().join(", ")} under "rails"
`);
  });
}

// src/cli/nets.ts
function netsJson(c) {
  return {
    file: c.file,
    parts: c.parts.map((p) => ({ ref: p.ref, value: p.value, kind: p.kind, pins: p.pins })),
    nets: c.nets.map((n) => ({ name: n.name, pins: n.pins.map((p) => `${p.ref}.${p.pin}`) }))
  };
}
function table(header, rows, c) {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? "").length)));
  const line = (cells) => cells.map((cell, i) => i === cells.length - 1 ? cell : cell.padEnd(widths[i] ?? 0)).join("  ").trimEnd();
  return [c.bold(line(header)), ...rows.map(line)];
}
function formatNetsText(circuit, c = noColors) {
  const kind = circuit.format === "kicad_sch" ? "KiCad schematic" : "KiCad netlist";
  const sheets = circuit.sheets.length > 1 ? `, ${circuit.sheets.length} sheet instances` : "";
  const lines = [
    c.bold(`${circuit.file}`) + `  (${kind}, version ${circuit.version}${sheets}; ${circuit.parts.length} parts, ${circuit.nets.length} nets)`,
    "",
    ...table(["ref", "value", "kind", "pins \u2192 nets"], circuit.parts.map((p) => [
      p.ref + (p.dnp ? " (DNP)" : ""),
      p.value === "" ? "-" : p.value,
      p.kind,
      Object.entries(p.pins).map(([pin, net]) => `${pin}=${net}`).join("  ")
    ]), c),
    "",
    ...table(["net", "pins"], circuit.nets.map((n) => [
      n.name + (n.noConnect ? " (no-connect)" : ""),
      n.pins.map((p) => `${p.ref}.${p.pin}`).join(" ")
    ]), c),
    ""
  ];
  return lines.join("\n");
}
function formatReadError(e) {
  return `${e.file}:${e.line}:${e.column}: error: ${e.message}`;
}
function runNets(files, opts, io) {
  const colors = io.colors ?? noColors;
  let failed = false;
  const { roots, errors } = findRootSheets(files, io.fs);
  for (const e of errors) {
    io.err(`${formatReadError(e)}
`);
    failed = true;
  }
  for (const file of roots) {
    const result = readDesign(file, opts.projectRoot !== void 0 ? { fs: io.fs, projectRoot: opts.projectRoot } : { fs: io.fs });
    if (!result.ok) {
      io.err(`${formatReadError(result.error)}
`);
      failed = true;
      continue;
    }
    const circuit = result.circuit;
    for (const n of circuit.notes) io.err(`${n.file}:${n.line}:${n.column}: note: ${n.message}
`);
    io.out(opts.json ? `${JSON.stringify(netsJson(circuit))}
` : formatNetsText(circuit, colors));
  }
  return failed ? 2 : 0;
}
function register5(program3) {
  program3.command("nets").description("show the parts and nets read from schematics or exported netlists").argument("<files...>", ".kicad_sch root sheets or .net netlists (sub-sheets of a given root are not listed twice)").option("--json", "one JSON object per design, one per line").option("--project-root <dir>", "folder that sheets and model libraries must stay inside (default: each root file's folder)").option("--no-color", "plain text without colours").action((files, opts) => {
    const colors = createColors(!opts.json && opts.color && process.stdout.isTTY === true && !process.env["NO_COLOR"]);
    let status;
    try {
      status = runNets(files, { json: opts.json === true, ...opts.projectRoot !== void 0 ? { projectRoot: opts.projectRoot } : {} }, {
        fs: nodeFileSource(),
        out: (t) => {
          process.stdout.write(t);
        },
        err: (t) => {
          process.stderr.write(t);
        },
        colors
      });
    } catch (err) {
      if (!(err instanceof RangeError)) throw err;
      process.stderr.write(`loadline: error: input too large or too deeply nested to read (${err.message})
`);
      status = 2;
    }
    process.exitCode = status;
  });
}

// src/cli/rules.ts
function formatRuleList(rules, c) {
  const width = Math.max(4, ...rules.map((r) => r.id.length));
  const lines = [c.bold(`${"rule".padEnd(width)}  ${"default".padEnd(7)}  title`)];
  for (const rule of [...rules].sort((a, b) => a.id < b.id ? -1 : 1)) {
    lines.push(`${c.magenta(rule.id.padEnd(width))}  ${rule.severity.padEnd(7)}  ${rule.title}`);
  }
  lines.push("", c.dim('`loadline rules ID` explains one; set severities and options under "rules" in loadline.json.'));
  return `${lines.join("\n")}
`;
}
function explainRule(rules, id) {
  const rule = rules.find((r) => r.id === id);
  if (rule) return { ok: true, text: `${ruleHelpText(rule)}
` };
  const near = rules.map((r) => r.id).filter((known) => editDistance(id, known) <= 2);
  const hint = near.length > 0 ? ` (did you mean ${near.map((n) => `'${n}'`).join(" or ")}?)` : "";
  return { ok: false, message: `unknown rule '${id}'${hint}; \`loadline rules\` lists them` };
}
function register6(program3) {
  program3.command("rules").description("list the rules, or explain one").argument("[id]", "a rule id").option("--no-color", "plain text without colours").action((id, opts) => {
    const colors = createColors(opts.color && process.stdout.isTTY === true && !process.env["NO_COLOR"]);
    if (id === void 0) {
      process.stdout.write(formatRuleList(allRules, colors));
      return;
    }
    const explained = explainRule(allRules, id);
    if (explained.ok) process.stdout.write(explained.text);
    else {
      process.stderr.write(`loadline: ${explained.message}
`);
      process.exitCode = 2;
    }
  });
}

// src/cli/commands.ts
var registrations = [register2, register, register6, register4, register3, register5];
function registerCommands(program3) {
  for (const register7 of registrations) register7(program3);
}

// src/cli/index.ts
var program2 = new Command("loadline").description("Design-rule checks for small-signal amplifier schematics (KiCad .kicad_sch / .net)").version(VERSION).showHelpAfterError().exitOverride((err) => {
  process.exit(err.exitCode === 0 ? 0 : 2);
});
registerCommands(program2);
program2.parseAsync(process.argv).catch((err) => {
  const message = err instanceof Error ? err.message : String(err);
  process.stderr.write(`loadline: internal error: ${message}
`);
  process.exit(2);
});
