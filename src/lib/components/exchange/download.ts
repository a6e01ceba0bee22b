// Fetch a file from the API and hand it to the browser as a download, or return the API's
// error message (a plain link would save the JSON error as the file).
export async function downloadFrom(url: string, init?: RequestInit): Promise<string | null> {
	const r = await fetch(url, init);
	if (!r.ok)
		return (await r.json().catch(() => null))?.error ?? `The download failed (${r.status}).`;
	const name = /filename\*=UTF-8''([^;]+)/.exec(r.headers.get('content-disposition') ?? '')?.[1];
	const blob = await r.blob();
	const a = document.createElement('a');
	a.href = URL.createObjectURL(blob);
	a.download = name ? decodeURIComponent(name) : 'download';
	document.body.append(a);
	a.click();
	a.remove();
	setTimeout(() => URL.revokeObjectURL(a.href), 10_000);
	return null;
}
