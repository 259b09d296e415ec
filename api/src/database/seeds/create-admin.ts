import 'reflect-metadata';
import { text } from 'node:stream/consumers';
import { DataSource } from 'typeorm';
import { loginSchema, newAccountSchema } from '@sixtyfold/shared';
import { hashPassword } from '../../auth/passwords';
import { readDatabaseConfig } from '../../config/database.config';
import { User } from '../../users/entities/user.entity';
import { buildDataSourceOptions } from '../typeorm-options';

// The e-mail as sign-in reads it, the name and password under a new account's rules.
const adminAccountSchema = newAccountSchema.extend({ email: loginSchema.shape.email });

/**
 * `npm run create-admin -w api -- <e-mail> "<name>"`, with the password on standard input: the
 * first site administrator of a site that gets no demo scenario (NODE_ENV=production), or another
 * one. It creates a new account only; an existing address is refused.
 */
async function main(): Promise<void> {
  const [email, displayName] = process.argv.slice(2);
  const password = (await text(process.stdin)).replace(/\r?\n$/, '');
  const parsed = adminAccountSchema.safeParse({ email, displayName, password });
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
    throw new Error(`${problems} (usage: create-admin <e-mail> "<name>", the password on standard input)`);
  }
  const account = parsed.data;
  const ds = new DataSource(buildDataSourceOptions(readDatabaseConfig()));
  await ds.initialize();
  try {
    const users = ds.getRepository(User);
    if (await users.existsBy({ email: account.email })) throw new Error(`${account.email} already has an account`);
    const user = await users.save(
      users.create({ email: account.email, displayName: account.displayName, siteRole: 'admin', passwordHash: await hashPassword(account.password) }),
    );
    process.stdout.write(`site administrator ${user.email} created\n`);
  } finally {
    await ds.destroy();
  }
}

main().catch((err: unknown) => {
  process.stderr.write(`creating the administrator failed: ${err instanceof Error ? err.message : String(err)}\n`);
  process.exit(1);
});
