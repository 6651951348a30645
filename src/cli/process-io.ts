// The one place the commands meet the process: its streams, folder, terminal and environment.
// Commands take a CommandIo so tests can run them without a process of their own.

export interface CommandIo {
  stdout: (s: string) => void;
  stderr: (s: string) => void;
  cwd: string;
  isTTY: boolean;
  env: NodeJS.ProcessEnv;
}

export function processIo(): CommandIo {
  return {
    stdout: (s) => process.stdout.write(s),
    stderr: (s) => process.stderr.write(s),
    cwd: process.cwd(),
    isTTY: process.stdout.isTTY === true,
    env: process.env,
  };
}
