// Read-only links. The token is shown once, when the link is made; only its hash is stored.
import { sharingModels } from './models/sharing';
import { hashSecretToken, newSecretToken, TOKEN_PATTERN } from '../sharing/secret-token';

export interface ShareLinkRecord {
	id: string;
	sheetId: string;
	label: string | null;
	createdBy: string | null;
	createdAt: Date;
}

const FIELDS = ['id', 'sheetId', 'label', 'createdBy', 'createdAt'] as const;

export async function createShareLink(sheetId: string, createdBy: string, label: string | null = null) {
	const token = newSecretToken();
	const row = await sharingModels().ShareLink.create({ sheetId, createdBy, label, tokenHash: hashSecretToken(token) });
	const link: ShareLinkRecord = { id: row.id, sheetId, label: row.label, createdBy, createdAt: row.createdAt };
	return { link, token };
}

export async function listShareLinks(sheetId: string): Promise<ShareLinkRecord[]> {
	const rows = await sharingModels().ShareLink.findAll({
		where: { sheetId, revokedAt: null },
		attributes: [...FIELDS],
		order: [['createdAt', 'DESC']]
	});
	return rows.map((r) => r.get({ plain: true }) as ShareLinkRecord);
}

export async function revokeShareLink(sheetId: string, id: string): Promise<boolean> {
	const [count] = await sharingModels().ShareLink.update({ revokedAt: new Date() }, { where: { id, sheetId, revokedAt: null } });
	return count > 0;
}

/** The sheet a live link opens, or null (unknown, malformed or revoked: all look the same). */
export async function sheetIdForShareToken(token: string): Promise<string | null> {
	if (!TOKEN_PATTERN.test(token)) return null;
	const row = await sharingModels().ShareLink.findOne({ where: { tokenHash: hashSecretToken(token), revokedAt: null }, attributes: ['sheetId'] });
	return row?.sheetId ?? null;
}
