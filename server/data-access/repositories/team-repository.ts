import { randomBytes } from 'node:crypto';

import type { DataSource } from 'typeorm';

import type { Role } from '@rampart/collab/api/accounts';
import { MembershipEntity } from '../entities/membership.entity';
import { TeamEntity } from '../entities/team.entity';

export interface TeamRecord {
  id: string;
  slug: string;
  name: string;
}

/** A team seen by one of its members. */
export interface TeamWithRoleRecord extends TeamRecord {
  role: Role;
}

/** Teams table access. */
export class TeamRepository {
  constructor(private readonly _ds: DataSource) {}

  async findById(id: string): Promise<TeamRecord | null> {
    const t = await this._ds.getRepository(TeamEntity).findOneBy({ id });
    return t ? { id: t.id, slug: t.slug, name: t.name } : null;
  }

  /** Teams `userId` belongs to, with their role, by name. */
  async listForUser(userId: string): Promise<TeamWithRoleRecord[]> {
    const rows: Array<{ id: string; slug: string; name: string; role: Role }> =
      await this._ds.query(
        `SELECT t.id, t.slug, t.name, m.role
           FROM memberships m JOIN teams t ON t.id = m.team_id
          WHERE m.user_id = $1
          ORDER BY t.name, t.id`,
        [userId],
      );
    return rows.map((r) => ({ id: r.id, slug: r.slug, name: r.name, role: r.role }));
  }

  /** Creates a team with `ownerId` as its first owner, in one transaction. */
  async createWithOwner(name: string, ownerId: string): Promise<TeamRecord> {
    // Slugs only need to be unique and stable; user-made teams get a random suffix.
    const base = name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 80);
    const slug = `${base || 'team'}-${randomBytes(4).toString('hex')}`;
    return this._ds.transaction(async (m) => {
      const team = await m.save(TeamEntity, m.create(TeamEntity, { slug, name }));
      await m.insert(MembershipEntity, { teamId: team.id, userId: ownerId, role: 'owner' });
      return { id: team.id, slug: team.slug, name: team.name };
    });
  }
}
