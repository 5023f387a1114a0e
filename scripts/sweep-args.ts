/**
 * The command line's arguments: design or rating files, and `--plot` anywhere among them. Anything else
 * that looks like an option is refused, so a mistyped `--plots` is not read as a file that cannot be found.
 */
export const USAGE = "usage: npm run --silent sweep -- [--plot] FILE.json [FILE2.json ...]";

const ACCEPTED =
  "the command line accepts --plot (adds each stage's Levenspiel plot points to a design) and one or more design or rating files (FILE.json); a file whose name starts with - is given as ./-name.json";

export type SweepArgs = { files: string[]; plot: boolean } | { error: string };

export function readSweepArgs(argv: readonly string[]): SweepArgs {
  const files: string[] = [];
  let plot = false;
  for (const arg of argv) {
    // npm hands its "--" separator through; it ends nothing here.
    if (arg === "--") continue;
    if (arg === "--plot") plot = true;
    else if (arg.startsWith("-")) return { error: `unknown option "${arg}": ${ACCEPTED}` };
    else files.push(arg);
  }
  if (files.length === 0) return { error: `no design or rating file given; ${USAGE}` };
  return { files, plot };
}
