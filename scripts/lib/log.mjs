// Plain console output for the setup scripts: one line per step, and failures that say how to fix them.

export function step(message) {
  console.log(`\x1b[1m▸ ${message}\x1b[0m`);
}

export function note(message) {
  console.log(`  ${message}`);
}

export class SetupError extends Error {
  constructor(what, fix) {
    super(what);
    this.fix = fix;
  }
}

/** Runs the main function; a SetupError prints what failed and the fix, anything else its stack. */
export async function runMain(main) {
  try {
    await main();
  } catch (err) {
    console.error(`\n\x1b[31m✗ ${err instanceof SetupError ? err.message : 'Setup failed'}\x1b[0m`);
    if (err instanceof SetupError) {
      if (err.fix) console.error(`  How to fix: ${err.fix}`);
    } else {
      console.error(err);
    }
    process.exit(1);
  }
}
