// Upload limits. One number for measured-response files and attachments: 5 MB unless the
// operator sets POLEWISE_UPLOAD_LIMIT_BYTES (the built server's BODY_SIZE_LIMIT must stay above
// it; npm start and the tests set 8M).
export const DEFAULT_UPLOAD_LIMIT = 5 * 1024 * 1024;

export function uploadLimit(): number {
	const v = Number(process.env.POLEWISE_UPLOAD_LIMIT_BYTES);
	return Number.isInteger(v) && v > 0 ? v : DEFAULT_UPLOAD_LIMIT;
}

export const limitText = (bytes: number) =>
	bytes % (1024 * 1024) === 0 ? `${bytes / (1024 * 1024)} MB` : `${Math.round(bytes / 1024)} KB`;

/** Per sheet, so one sheet cannot fill the database. */
export const PER_SHEET = { measurements: 50, attachments: 100 };
