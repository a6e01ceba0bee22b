// Upload limits. One number for measured-response files and attachments: 5 MB unless the
// operator sets POLEWISE_UPLOAD_LIMIT_BYTES; the server's request-body limit follows it
// (config/index.ts), so no start script has to keep the two in step.
import { config } from '../config';
import DEFAULTS from '../config/defaults.json';

export const DEFAULT_UPLOAD_LIMIT = DEFAULTS.uploadLimitBytes;

export const uploadLimit = (): number => config().uploadLimitBytes;

export const limitText = (bytes: number) =>
	bytes % (1024 * 1024) === 0 ? `${bytes / (1024 * 1024)} MB` : `${Math.round(bytes / 1024)} KB`;

/** Per sheet, so one sheet cannot fill the database. */
export const PER_SHEET = { measurements: 50, attachments: 100 };
