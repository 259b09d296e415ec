import type { DataSource } from 'typeorm';
import { hashPassword } from '../../auth/passwords';
import { Group } from '../../groups/entities/group.entity';
import { Membership } from '../../groups/entities/membership.entity';
import { PotentialModel } from '../../models/entities/potential-model.entity';
import { User } from '../../users/entities/user.entity';
import { DEMO_GROUPS, DEMO_MODELS, DEMO_PASSWORD, DEMO_USERS } from './demo-scenario';

/**
 * Adds the demo scenario to a database without any account, and leaves a database that has
 * accounts alone: a demo admin with the published password must never appear beside real
 * people, nor come back after someone deleted it or changed its password.
 */
export async function seedDemoScenario(ds: DataSource): Promise<{ seeded: boolean }> {
  return ds.transaction(async (tx) => {
    // The lock keeps two starts at once from both finding the table empty.
    const anyone = await tx.getRepository(User).createQueryBuilder('u').setLock('pessimistic_write').limit(1).getOne();
    if (anyone) return { seeded: false };
    const groupIds = new Map<string, number>();
    for (const g of DEMO_GROUPS) {
      let group = await tx.findOne(Group, { where: { slug: g.slug } });
      if (!group) group = await tx.save(tx.create(Group, g));
      groupIds.set(g.slug, group.id);
    }
    const userIds = new Map<string, number>();
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    for (const u of DEMO_USERS) {
      const user = await tx.save(tx.create(User, { email: u.email, displayName: u.displayName, siteRole: u.siteRole, passwordHash }));
      for (const m of u.memberships) {
        await tx.insert(Membership, { groupId: groupIds.get(m.group)!, userId: user.id, role: m.role });
      }
      userIds.set(u.email, user.id);
    }
    for (const m of DEMO_MODELS) {
      const groupId = groupIds.get(m.group)!;
      if (await tx.exists(PotentialModel, { where: { groupId, name: m.name } })) continue;
      await tx.insert(PotentialModel, {
        groupId,
        name: m.name,
        expression: m.expression,
        parameters: m.parameters,
        phiInit: m.phiInit,
        description: m.description,
        createdById: userIds.get(m.createdBy) ?? null,
      });
    }
    return { seeded: true };
  });
}
