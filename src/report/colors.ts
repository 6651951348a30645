// The colour formatters reporters take as an argument. Decided at the edge (TTY, NO_COLOR,
// --no-color); tests and machine formats pass `noColors`.
import pc from "picocolors";

export type Colors = ReturnType<typeof pc.createColors>;

export const noColors: Colors = pc.createColors(false);

export function createColors(enabled: boolean): Colors {
  return pc.createColors(enabled);
}
