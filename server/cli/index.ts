/**
 * The `rhomb` command line: `npm run --silent rhomb -- <command> …`. A small dispatcher; each
 * command lives in its own file and returns the process exit code (0 ok, 2 bad input or usage).
 */
type Command = { run(args: string[]): Promise<number> };

const COMMANDS: Record<string, { summary: string; load: () => Promise<Command> }> = {
  reconstruct: { summary: "reconstruct FILE.csv --method mle|linear|projected [--json] …", load: () => import("./reconstruct") },
  bench: { summary: "bench FILE.csv --repeat N [--json]", load: () => import("./bench") },
  upload: { summary: "upload --session ID [--url URL] [--token TOKEN] [--no-wait] FILE… (run files, sweeps or zips, as one batch)", load: () => import("./upload") },
};

function usage(): string {
  return ["usage: rhomb <command> [options]", ...Object.values(COMMANDS).map((c) => `  rhomb ${c.summary}`)].join("\n");
}

async function main(argv: string[]): Promise<number> {
  const [name, ...rest] = argv;
  if (!name || name === "--help" || name === "-h") {
    process.stdout.write(`${usage()}\n`);
    return name ? 0 : 2;
  }
  const command = COMMANDS[name];
  if (!command) {
    process.stderr.write(`rhomb: unknown command "${name}" (try: ${Object.keys(COMMANDS).join(", ")})\n`);
    return 2;
  }
  return (await command.load()).run(rest);
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    process.stderr.write(`rhomb: ${(error as Error)?.stack ?? String(error)}\n`);
    process.exitCode = 1;
  },
);
