// Real processes for the multi-process test: app processes started exactly as the systemd units
// in deploy/systemd say (their Environment= lines and ExecStart), nginx with the configuration in
// deploy/nginx, and a small HTTP client that keeps a session cookie and notes which web process
// answered (the test's nginx adds X-Polewise-Upstream). All on loopback, on free ports.
import { spawn, type ChildProcess } from 'node:child_process';
import {
	chmodSync,
	existsSync,
	mkdirSync,
	mkdtempSync,
	readFileSync,
	rmSync,
	writeFileSync
} from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../../..', import.meta.url));
export const deployFile = (name: string) => path.join(root, 'deploy', name);

/** The built app to run: npm test's private copy, else the checkout's build. */
export function servedBuild(): string {
	const dir = process.env.POLEWISE_SERVE_DIR ?? path.join(root, 'build');
	if (!existsSync(path.join(dir, 'start.js'))) {
		throw new Error(
			`no built app in ${dir}: run this test through \`npm test\` (it builds and sets POLEWISE_SERVE_DIR)`
		);
	}
	return dir;
}

export function freePort(): Promise<number> {
	return new Promise((resolve, reject) => {
		const s = net.createServer();
		s.once('error', reject);
		s.listen(0, '127.0.0.1', () => {
			const { port } = s.address() as net.AddressInfo;
			s.close(() => resolve(port));
		});
	});
}

/** A unit file's Environment= settings (with %i filled in) and its ExecStart words. */
export function readUnit(name: string, instance = '') {
	const text = readFileSync(deployFile(`systemd/${name}`), 'utf8').replaceAll('%i', instance);
	const env: Record<string, string> = {};
	let exec: string[] = [];
	for (const line of text.split('\n')) {
		const m = /^(Environment|ExecStart)=(.*)$/.exec(line.trim());
		if (!m) continue;
		if (m[1] === 'Environment') {
			const [k, ...v] = m[2].split('=');
			env[k] = v.join('=');
		} else exec = m[2].split(/\s+/);
	}
	return { env, exec };
}

export interface Proc {
	name: string;
	child: ChildProcess;
	output: () => string;
	exited: Promise<number | null>;
}

/** Start the unit's command from the built app, with the shared settings plus the unit's own. */
export function startUnit(
	name: string,
	unit: string,
	instance: string,
	shared: Record<string, string>
): Proc {
	const build = servedBuild();
	const { env, exec } = readUnit(unit, instance);
	if (!exec[0]?.endsWith('/node'))
		throw new Error(`${unit}: ExecStart is not node: ${exec.join(' ')}`);
	// The unit runs from the release folder: `build` there is the built app given to this test.
	const args = exec
		.slice(1)
		.map((a) =>
			a === 'build' ? build : a.startsWith('build/') ? path.join(build, a.slice(6)) : a
		);
	return startProc(name, process.execPath, args, { ...shared, ...env });
}

export function startProc(
	name: string,
	command: string,
	args: string[],
	env: Record<string, string>
): Proc {
	const child = spawn(command, args, {
		cwd: root,
		env: { ...process.env, ...env },
		stdio: ['ignore', 'pipe', 'pipe']
	});
	let out = '';
	child.stdout!.on('data', (d) => (out += d));
	child.stderr!.on('data', (d) => (out += d));
	const exited = new Promise<number | null>((resolve) =>
		child.once('exit', (code) => resolve(code))
	);
	return { name, child, output: () => out, exited };
}

export async function stopProc(p: Proc, signal: NodeJS.Signals = 'SIGTERM'): Promise<void> {
	if (p.child.exitCode !== null || p.child.signalCode !== null) return;
	p.child.kill(signal);
	const late = setTimeout(() => p.child.kill('SIGKILL'), 10_000);
	await p.exited;
	clearTimeout(late);
}

/** Poll until fn() is truthy (or throw with what was last seen after `ms`). */
export async function waitFor<T>(
	what: string,
	fn: () => Promise<T | null | undefined | false>,
	ms = 60_000
): Promise<T> {
	const end = Date.now() + ms;
	let last: unknown = null;
	for (;;) {
		try {
			const v = await fn();
			if (v) return v;
			last = v;
		} catch (e) {
			last = e;
		}
		if (Date.now() > end)
			throw new Error(
				`waited ${ms / 1000} s for ${what}; last: ${last instanceof Error ? last.message : JSON.stringify(last)}`
			);
		await new Promise((ok) => setTimeout(ok, 150));
	}
}

/** nginx in the foreground with deploy/nginx's files, in front of the given web ports. */
export function startNginx(port: number, webPorts: number[]) {
	const nginx = process.env.POLEWISE_NGINX ?? '/usr/sbin/nginx';
	if (!existsSync(nginx))
		throw new Error(
			`nginx is missing at ${nginx}: run this test through \`npm test\` (it installs Debian's nginx-light)`
		);
	const dir = mkdtempSync(path.join(os.tmpdir(), 'polewise-nginx-'));
	chmodSync(dir, 0o755);
	// nginx's workers run as an unprivileged user when the master is root: its temp folders must be theirs to write.
	for (const sub of ['body', 'proxy', 'fastcgi', 'uwsgi', 'scgi']) {
		mkdirSync(path.join(dir, sub));
		chmodSync(path.join(dir, sub), 0o777);
	}
	const ports = [...webPorts];
	const upstream = readFileSync(deployFile('nginx/polewise-upstream.conf'), 'utf8').replace(
		/server 127\.0\.0\.1:\d+;/g,
		() => `server 127.0.0.1:${ports.shift()};`
	);
	if (ports.length)
		throw new Error(
			'deploy/nginx/polewise-upstream.conf lists fewer web processes than the test starts'
		);
	writeFileSync(path.join(dir, 'upstream.conf'), upstream);
	writeFileSync(
		path.join(dir, 'nginx.conf'),
		`worker_processes 1;
pid ${dir}/nginx.pid;
error_log ${dir}/error.log warn;
events { worker_connections 256; }
http {
    access_log off;
    client_body_temp_path ${dir}/body;
    proxy_temp_path ${dir}/proxy;
    fastcgi_temp_path ${dir}/fastcgi;
    uwsgi_temp_path ${dir}/uwsgi;
    scgi_temp_path ${dir}/scgi;
    include ${dir}/upstream.conf;
    server {
        listen 127.0.0.1:${port};
        # Only in the test: which web process answered.
        add_header X-Polewise-Upstream $upstream_addr always;
        include ${deployFile('nginx/polewise-locations.conf')};
    }
}
`
	);
	const proc = startProc(
		'nginx',
		nginx,
		['-p', dir, '-c', path.join(dir, 'nginx.conf'), '-g', 'daemon off;'],
		{}
	);
	return { proc, cleanup: () => rmSync(dir, { recursive: true, force: true }) };
}

/** A browser stand-in: one session cookie, same-origin headers, the upstream of each answer. */
export class Client {
	cookie = '';
	upstreams: string[] = [];
	constructor(readonly origin: string) {}

	async request(method: string, url: string, body?: unknown, headers: Record<string, string> = {}) {
		const init: RequestInit & { duplex?: 'half' } = {
			method,
			redirect: 'manual',
			headers: { origin: this.origin, ...headers }
		};
		if (this.cookie) (init.headers as Record<string, string>).cookie = this.cookie;
		// A browser posting a page's form asks for HTML (SvelteKit answers a redirect then, not JSON).
		if (body instanceof URLSearchParams)
			(init.headers as Record<string, string>).accept = 'text/html';
		if (body instanceof FormData || body instanceof URLSearchParams) init.body = body;
		else if (body !== undefined) {
			init.body = JSON.stringify(body);
			(init.headers as Record<string, string>)['content-type'] = 'application/json';
		}
		const res = await fetch(this.origin + url, init);
		const session = res.headers.getSetCookie().find((c) => c.startsWith('pw_session='));
		if (session) this.cookie = session.split(';')[0];
		this.upstreams.push(res.headers.get('x-polewise-upstream') ?? '');
		return res;
	}

	async json(method: string, url: string, body?: unknown) {
		const res = await this.request(method, url, body);
		const text = await res.text();
		return {
			status: res.status,
			// This answer's own header (requests may run concurrently).
			upstream: res.headers.get('x-polewise-upstream') ?? '',
			body: text ? JSON.parse(text) : null
		};
	}

	get last() {
		return this.upstreams.at(-1)!;
	}
}
