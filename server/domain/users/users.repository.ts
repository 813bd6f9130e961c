// The only code that touches the users table.
import type { Role } from '../auth/scopes.ts';
import type { Queryable } from '../../db/transaction.ts';
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import type { Page } from '../../lib/pagination.ts';

export type UserStatus = 'invited' | 'active' | 'disabled';

export interface UserRow {
  id: string;
  email: string;
  email_key: string;
  name: string;
  role: Role;
  status: UserStatus;
  password_hash: string | null;
  created_at: string;
  updated_at: string;
  last_login_at: string | null;
}

export function emailKey(email: string): string {
  return email.trim().toLowerCase();
}

export function toUser(row: UserRow) {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    status: row.status,
    created_at: row.created_at,
    updated_at: row.updated_at,
    last_login_at: row.last_login_at,
  };
}

export type User = ReturnType<typeof toUser>;

export function findUserById(db: Queryable, id: string): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ id }).first();
}

export function findUserByEmail(db: Queryable, email: string): Promise<UserRow | undefined> {
  return db<UserRow>('users')
    .where({ email_key: emailKey(email) })
    .first();
}

export async function insertUser(db: Queryable, row: UserRow): Promise<void> {
  await db<UserRow>('users').insert(row);
}

export async function updateUserRow(db: Queryable, id: string, changes: Partial<UserRow>): Promise<void> {
  await db<UserRow>('users').where({ id }).update(changes);
}

export async function countActiveAdmins(db: Queryable): Promise<number> {
  const row = await db('users').where({ role: 'admin', status: 'active' }).count<{ n: number | string }[]>({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

/** The longest-standing active admin (ids sort by creation time). */
export function findFirstActiveAdmin(db: Queryable): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ role: 'admin', status: 'active' }).orderBy('id').first();
}

export async function countUsers(db: Queryable): Promise<number> {
  const row = await db('users').count<{ n: number | string }[]>({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

const USER_KEYSET: KeysetColumn<UserRow>[] = [{ column: 'id', order: 'asc', key: 'id', valueOf: (row) => row.id }];

export function listUserRows(db: Queryable, filters: { role?: Role; status?: UserStatus }, page: PageRequest): Promise<Page<UserRow>> {
  const query = db<UserRow>('users');
  if (filters.role) query.where('role', filters.role);
  if (filters.status) query.where('status', filters.status);
  return keysetPage(query, USER_KEYSET, page);
}
