import net from 'node:net';

/** True when nothing listens on host:port (we can bind it ourselves). */
export function isPortFree(port, host = '127.0.0.1') {
	return new Promise((resolve) => {
		const server = net.createServer();
		server.once('error', () => resolve(false));
		server.listen(port, host, () => server.close(() => resolve(true)));
	});
}

/** A port the operating system says is free right now, on loopback. */
export function freePort() {
	return new Promise((resolve, reject) => {
		const server = net.createServer();
		server.once('error', reject);
		server.listen(0, '127.0.0.1', () => {
			const { port } = server.address();
			server.close(() => resolve(port));
		});
	});
}
