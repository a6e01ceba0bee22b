// Shared set-up of the design-aid integration tests: two people, and one sheet of Ana's holding
// the demo divider as revision 1 (Eve is in no workspace of hers).
import { person } from './support/fixtures';
import { createWorkspace } from '../../src/lib/server/db/workspaces';
import { createSheet } from '../../src/lib/server/db/sheets';
import { digitizerDivider } from '../../src/lib/server/db/seed/demo-sheets';

export async function dividerSheet() {
	const [ana, eve] = [await person('Ana'), await person('Eve')];
	const ws = await createWorkspace(ana.id, 'Design bench');
	const { sheet } = await createSheet({
		userId: ana.id,
		workspaceId: ws.id,
		name: 'Divider',
		document: digitizerDivider
	});
	return { ana, eve, sheet };
}
