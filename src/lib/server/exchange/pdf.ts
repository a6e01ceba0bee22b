// The PDF of the review report: the report page printed by headless Chromium (Debian's
// /usr/bin/chromium, driven by playwright-core — the browser the tests already use). Printing
// the page itself means the PDF is exactly what the person sees, vector schematic and plots
// included, with no second layout to keep in step (docs/exchange.md says why over pdf-lib).
// The browser asks for the page as the caller: their session cookie or API token is passed on.
import { ApiProblem } from '../api/respond';
import { config } from '../config';

const MAX_AT_ONCE = 2;
const TIMEOUT_MS = 30_000;
let running = 0;

export interface PdfRequest {
	/** Where this server answers for its own pages (the request's origin unless configured). */
	origin: string;
	path: string;
	cookie: string | null;
	authorization: string | null;
}

export async function printToPdf(req: PdfRequest): Promise<Buffer> {
	if (running >= MAX_AT_ONCE)
		throw new ApiProblem(503, 'Other reports are being printed; try again in a moment.', {
			code: 'busy'
		});
	running++;
	const { chromium } = await import('playwright-core');
	const browser = await chromium
		.launch({ executablePath: config().chromium, args: ['--disable-gpu', '--disable-quic'] })
		.catch((e: Error) => {
			running--;
			throw new ApiProblem(
				503,
				`The PDF printer (headless Chromium at ${config().chromium}) could not start: ${e.message.split('\n')[0]}`,
				{ code: 'no_printer' }
			);
		});
	try {
		const headers: Record<string, string> = {};
		// Paper is always the light theme: the caller's theme choice is not passed on.
		const cookie = req.cookie
			?.split(/;\s*/)
			.filter((c) => c && !c.startsWith('pw-theme='))
			.join('; ');
		if (cookie) headers.cookie = cookie;
		if (req.authorization) headers.authorization = req.authorization;
		const context = await browser.newContext({ extraHTTPHeaders: headers });
		const page = await context.newPage();
		const response = await page.goto(new URL(req.path, req.origin).toString(), {
			waitUntil: 'networkidle',
			timeout: TIMEOUT_MS
		});
		if (!response || response.status() !== 200)
			throw new ApiProblem(
				response?.status() === 404 ? 404 : 502,
				'The report page could not be opened for printing.'
			);
		await page.locator('[data-report-ready]').waitFor({ timeout: TIMEOUT_MS });
		await page.emulateMedia({ media: 'print' });
		return await page.pdf({ format: 'A4', printBackground: true, preferCSSPageSize: true });
	} finally {
		running--;
		await browser.close();
	}
}
