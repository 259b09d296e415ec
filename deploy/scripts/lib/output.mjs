// One voice for the set-up scripts: short lines prefixed with the product name.
export function log(message) {
  process.stdout.write(`[sixtyfold] ${message}\n`);
}

export function fail(message) {
  process.stderr.write(`[sixtyfold] error: ${message}\n`);
  process.exit(1);
}
