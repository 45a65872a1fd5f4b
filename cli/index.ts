import { runAgreement } from "./commands/agreement";
import { runSuggest } from "./commands/suggest";
import { runTune } from "./commands/tune";
import { CliError } from "./errors";

const commands: Record<string, (args: string[]) => Promise<void>> = {
  suggest: runSuggest,
  tune: runTune,
  agreement: runAgreement,
};

const usage = `usage: npm run --silent cli -- <command> [options]
commands:
  suggest   --labelled L.csv --items I.csv [--k 5] [--distance euclidean|manhattan|cosine]
            [--scaling zscore|minmax|none] [--weighting uniform|inverse]
            [--id-column id] [--label-column label]
  tune      --labelled L.csv [--k 1,3,5] [--distance euclidean,cosine] [--scaling zscore]
  agreement --labels F.csv   (long format: item,annotator,label)`;

async function main() {
  const [name, ...rest] = process.argv.slice(2);
  const command = name ? commands[name] : undefined;
  if (!command) {
    process.stderr.write(`${name ? `unknown command '${name}'\n` : ""}${usage}\n`);
    process.exit(2);
  }
  try {
    await command(rest);
  } catch (error) {
    if (error instanceof CliError) {
      process.stderr.write(`vicinal ${name}: ${error.message}\n`);
      process.exit(1);
    }
    throw error;
  }
}

void main();
