import { spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';

export interface TestCertificates {
  /** The private CA's certificate: what REDIS_TLS_CA_FILE and DATABASE_TLS_CA_FILE name. */
  ca: string;
  /** The servers' certificate, signed by the CA, naming `addresses`; and its key. */
  cert: string;
  key: string;
}

function openssl(args: string[], cwd: string): void {
  const r = spawnSync('openssl', args, { cwd, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`openssl ${args[0]} failed: ${r.stderr ?? r.error?.message}`);
}

/** A private CA and one server certificate for the given IP addresses, made with the openssl command in `dir`. */
export function makeTestCertificates(dir: string, addresses: string[]): TestCertificates {
  mkdirSync(dir, { recursive: true });
  writeFileSync(path.join(dir, 'server.ext'), `subjectAltName=${addresses.map((a) => `IP:${a}`).join(',')}\n`);
  openssl(['req', '-x509', '-newkey', 'rsa:2048', '-nodes', '-days', '2', '-subj', '/CN=Sixtyfold test CA',
    '-addext', 'basicConstraints=critical,CA:TRUE', '-addext', 'keyUsage=critical,keyCertSign,cRLSign',
    '-keyout', 'ca.key', '-out', 'ca.pem'], dir);
  openssl(['req', '-newkey', 'rsa:2048', '-nodes', '-subj', '/CN=sixtyfold-test-server', '-keyout', 'server.key', '-out', 'server.csr'], dir);
  openssl(['x509', '-req', '-in', 'server.csr', '-CA', 'ca.pem', '-CAkey', 'ca.key', '-CAcreateserial', '-days', '2',
    '-extfile', 'server.ext', '-out', 'server.pem'], dir);
  return { ca: path.join(dir, 'ca.pem'), cert: path.join(dir, 'server.pem'), key: path.join(dir, 'server.key') };
}
