// Migrations are listed here in order (not found by a glob) so the same list works under tsx
// and inside the built server. Add a file, then add it to this list; never edit a shipped one.
import type { QueryInterface } from 'sequelize';
import * as m0001 from './0001-accounts-and-sheets';

export interface Migration {
	name: string;
	up: (params: { context: QueryInterface }) => Promise<void>;
	down: (params: { context: QueryInterface }) => Promise<void>;
}

export const migrations: Migration[] = [{ name: '0001-accounts-and-sheets', ...m0001 }];
