import argon2 from 'argon2';
import { randomBytes } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { GroupRole } from '@sixtyfold/shared';
import { DEMO_PASSWORD } from '../../src/database/seeds/demo-scenario';
import { Group } from '../../src/groups/entities/group.entity';
import { Membership } from '../../src/groups/entities/membership.entity';
import { User } from '../../src/users/entities/user.entity';

/** A short random tag, so that names and addresses made by one run never meet an earlier run's counts. */
export const runTag = () => randomBytes(3).toString('hex');

/**
 * A new account with the demo password, optionally in a group with a role. Limits counted per
 * user (sign-ins, e-mails) start at zero for it, whatever the other suites did with the demo users.
 */
export async function createUser(db: DataSource, handle: string, membership?: { groupSlug: string; role: GroupRole }): Promise<User> {
  const user = await db.getRepository(User).save({
    email: `${handle}@halvorsen.example`,
    displayName: handle,
    passwordHash: await argon2.hash(DEMO_PASSWORD, { type: argon2.argon2id }),
  });
  if (membership) {
    const group = await db.getRepository(Group).findOneByOrFail({ slug: membership.groupSlug });
    await db.getRepository(Membership).insert({ groupId: group.id, userId: user.id, role: membership.role });
  }
  return user;
}
