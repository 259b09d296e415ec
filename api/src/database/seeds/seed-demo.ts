import type { DataSource } from 'typeorm';
import { hashPassword } from '../../auth/passwords';
import { Group } from '../../groups/entities/group.entity';
import { Membership } from '../../groups/entities/membership.entity';
import { PotentialModel } from '../../models/entities/potential-model.entity';
import { User } from '../../users/entities/user.entity';
import { DEMO_GROUPS, DEMO_MODELS, DEMO_PASSWORD, DEMO_USERS } from './demo-scenario';

/**
 * Adds whatever part of the demo scenario is missing and changes nothing that exists, so it
 * can run at every start without touching a password or a role someone changed.
 */
export async function seedDemoScenario(ds: DataSource): Promise<{ created: number }> {
  let created = 0;
  await ds.transaction(async (tx) => {
    const groupIds = new Map<string, number>();
    for (const g of DEMO_GROUPS) {
      let group = await tx.findOne(Group, { where: { slug: g.slug } });
      if (!group) {
        group = await tx.save(tx.create(Group, g));
        created++;
      }
      groupIds.set(g.slug, group.id);
    }
    const userIds = new Map<string, number>();
    for (const u of DEMO_USERS) {
      let user = await tx.findOne(User, { where: { email: u.email } });
      if (!user) {
        user = await tx.save(
          tx.create(User, {
            email: u.email,
            displayName: u.displayName,
            siteRole: u.siteRole,
            passwordHash: await hashPassword(DEMO_PASSWORD),
          }),
        );
        created++;
        // Memberships come with a new account only, so a role changed later stays changed.
        for (const m of u.memberships) {
          await tx.insert(Membership, { groupId: groupIds.get(m.group)!, userId: user.id, role: m.role });
        }
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
      created++;
    }
  });
  return { created };
}
