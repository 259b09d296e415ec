import { describe, expect, it } from 'vitest';
import { scanPlaneQuerySchema } from './scan-plane.schema.js';

describe('scanPlaneQuerySchema', () => {
  it('reads the limit from a query string and defaults to 20,000', () => {
    expect(scanPlaneQuerySchema.parse({})).toEqual({ limit: 20_000 });
    expect(scanPlaneQuerySchema.parse({ limit: '7' })).toEqual({ limit: 7 });
  });

  it('keeps the limit a whole number from 1 to 100,000', () => {
    for (const limit of ['0', '100001', '2.5', 'many']) expect(scanPlaneQuerySchema.safeParse({ limit }).success).toBe(false);
    expect(scanPlaneQuerySchema.parse({ limit: '100000' }).limit).toBe(100_000);
  });
});
