/** An error the user can act on: printed on stderr without a stack, exit code 1. */
export class CliError extends Error {}

/** Parses `--name value` pairs; flags without a value are an error. */
export function parseFlags(args: string[], allowed: readonly string[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (let i = 0; i < args.length; i += 1) {
    const arg = args[i];
    if (!arg.startsWith("--")) throw new CliError(`unexpected argument '${arg}'`);
    const name = arg.slice(2);
    if (!allowed.includes(name)) throw new CliError(`unknown option '--${name}' (allowed: ${allowed.map((a) => `--${a}`).join(", ")})`);
    const value = args[i + 1];
    if (value === undefined || value.startsWith("--")) throw new CliError(`option '--${name}' needs a value`);
    out[name] = value;
    i += 1;
  }
  return out;
}
