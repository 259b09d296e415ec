import { Logger } from '@nestjs/common';
import { registerAs } from '@nestjs/config';
import { execFileSync } from 'node:child_process';
import { z } from 'zod';
import { ENGINE_VERSION, type BuildInfo } from '@sixtyfold/shared';
import { parseEnv } from './parse-env';

const schema = z.object({
  /** The git commit of this build, for deployments without a .git folder; otherwise read with `git rev-parse HEAD`. */
  SIXTYFOLD_COMMIT: z
    .string()
    .regex(/^[0-9a-f]{7,40}$/i, 'SIXTYFOLD_COMMIT must be a git commit id (7 to 40 hex digits)')
    .optional(),
});

/**
 * What this process is built from, recorded with every scan it submits (API) or chunk it
 * computes (worker): the engine version, the git commit and Node's version. Read once at start-up;
 * the API and the worker both load this factory.
 */
export function readBuildConfig(env: NodeJS.ProcessEnv = process.env): BuildInfo {
  const e = parseEnv(schema, env, 'build');
  return { engineVersion: ENGINE_VERSION, commit: e.SIXTYFOLD_COMMIT?.toLowerCase() ?? gitCommit(), node: process.version };
}

/** HEAD of the repository the process runs from, or "unknown" (with a warning) where there is none. */
function gitCommit(): string {
  try {
    return execFileSync('git', ['rev-parse', 'HEAD'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'], timeout: 5000 }).trim();
  } catch {
    new Logger('BuildConfig').warn('the git commit could not be read (no git or no .git here) and SIXTYFOLD_COMMIT is unset: scans record the commit as "unknown"');
    return 'unknown';
  }
}

export const buildConfig = registerAs('build', () => readBuildConfig());
