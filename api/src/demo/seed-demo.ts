import bcrypt from 'bcryptjs';
import type { DataSource } from 'typeorm';
import { Lab } from '../accounts/lab.entity';
import { Membership } from '../accounts/membership.entity';
import { User } from '../accounts/user.entity';
import { DEMO_ACCOUNTS, DEMO_LAB_NAME, DEMO_PASSWORD } from './demo-accounts';

/**
 * Loads the demo lab into an empty database. Returns false (and changes nothing) when any lab exists, so
 * running the start command again never duplicates or overwrites anything.
 */
export async function seedDemo(dataSource: DataSource): Promise<boolean> {
  return dataSource.transaction(async (manager) => {
    if ((await manager.count(Lab)) > 0) return false;
    const lab = await manager.save(manager.create(Lab, { name: DEMO_LAB_NAME }));
    const passwordHash = await bcrypt.hash(DEMO_PASSWORD, 10);
    for (const account of DEMO_ACCOUNTS) {
      const user = await manager.save(
        manager.create(User, { email: account.email, displayName: account.displayName, passwordHash }),
      );
      await manager.save(manager.create(Membership, { labId: lab.id, userId: user.id, role: account.role }));
    }
    return true;
  });
}
