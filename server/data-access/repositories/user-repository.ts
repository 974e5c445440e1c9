import type { DataSource } from 'typeorm';

import { UserEntity } from '../entities/user.entity';

/** A user as the rest of the server sees it (no password hash). */
export interface UserRecord {
  id: string;
  email: string;
  name: string;
  createdAt: Date;
}

/** A user with the hash, for the password check only. */
export interface UserCredentialsRecord extends UserRecord {
  passwordHash: string;
}

function toRecord(e: UserEntity): UserRecord {
  return { id: e.id, email: e.email, name: e.name, createdAt: e.createdAt };
}

/** Users table access. E-mails are compared lower-case. */
export class UserRepository {
  constructor(private readonly _ds: DataSource) {}

  private get _repo() {
    return this._ds.getRepository(UserEntity);
  }

  async findById(id: string): Promise<UserRecord | null> {
    const e = await this._repo.findOneBy({ id });
    return e ? toRecord(e) : null;
  }

  async findCredentialsByEmail(email: string): Promise<UserCredentialsRecord | null> {
    const e = await this._repo.findOneBy({ email: email.toLowerCase() });
    return e ? { ...toRecord(e), passwordHash: e.passwordHash } : null;
  }

  async findCredentialsById(id: string): Promise<UserCredentialsRecord | null> {
    const e = await this._repo.findOneBy({ id });
    return e ? { ...toRecord(e), passwordHash: e.passwordHash } : null;
  }

  /** Inserts a user; resolves null when the e-mail is taken (unique index). */
  async create(input: {
    email: string;
    name: string;
    passwordHash: string;
  }): Promise<UserRecord | null> {
    const result = await this._repo
      .createQueryBuilder()
      .insert()
      .values({ ...input, email: input.email.toLowerCase() })
      .orIgnore()
      .returning(['id'])
      .execute();
    const id = (result.raw as Array<{ id: string }>)[0]?.id;
    return id ? this.findById(id) : null;
  }

  async updatePasswordHash(id: string, passwordHash: string): Promise<void> {
    await this._repo.update({ id }, { passwordHash });
  }
}
