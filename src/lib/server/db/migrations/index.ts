// Migrations are listed here in order (not found by a glob) so the same list works under tsx
// and inside the built server. Add a file, then add it to this list; never edit a shipped one.
import type { QueryInterface } from 'sequelize';
import * as m0001 from './0001-accounts-and-sheets';
import * as m0002 from './0002-auth';
import * as m0003 from './0003-sharing';
import * as m0004 from './0004-design';
import * as m0005 from './0005-review';
import * as m0006 from './0006-exchange';
import * as m0007 from './0007-job-recovery';
import * as m0008 from './0008-sign-up-requests';
import * as m0009 from './0009-job-parts';
import * as m0010 from './0010-revision-names';
import * as m0011 from './0011-explicit-checkpoints';

export interface Migration {
	name: string;
	up: (params: { context: QueryInterface }) => Promise<void>;
	down: (params: { context: QueryInterface }) => Promise<void>;
}

export const migrations: Migration[] = [
	{ name: '0001-accounts-and-sheets', ...m0001 },
	{ name: '0002-auth', ...m0002 },
	{ name: '0003-sharing', ...m0003 },
	{ name: '0004-design', ...m0004 },
	{ name: '0005-review', ...m0005 },
	{ name: '0006-exchange', ...m0006 },
	{ name: '0007-job-recovery', ...m0007 },
	{ name: '0008-sign-up-requests', ...m0008 },
	{ name: '0009-job-parts', ...m0009 },
	{ name: '0010-revision-names', ...m0010 },
	{ name: '0011-explicit-checkpoints', ...m0011 }
];
