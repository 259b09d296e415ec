import { readFileSync } from 'node:fs';

/**
 * Reads a PEM file named by a configuration variable at boot, so a wrong path stops the start
 * with the variable's name instead of failing at the first connection.
 */
export function readPemFile(area: string, variable: string, file: string): string {
  try {
    const pem = readFileSync(file, 'utf8');
    if (!pem.includes('-----BEGIN')) throw new Error('not a PEM file');
    return pem;
  } catch (err) {
    throw new Error(`Invalid ${area} configuration: ${variable}: cannot read ${file} (${(err as Error).message})`);
  }
}
