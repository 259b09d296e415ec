/**
 * The engine's version: the shared package's version, recorded with every scan and every chunk a
 * worker computes (a test keeps it equal to shared/package.json's "version"; bump both together).
 */
export const ENGINE_VERSION = '0.1.0';
