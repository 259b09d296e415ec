import { spawnSync } from 'node:child_process';

/**
 * Network namespaces that stand in for other machines: each gets a veth pair on its own
 * 10.231.x.y/30, the host end on .1 of the /30 and the namespace end on .2. Names carry the
 * test process's pid, so parallel runs on one machine never meet.
 */
export interface Machine {
  /** The namespace, for `ip netns exec`. */
  netns: string;
  /** The host's address on this link: servers bound to it are what the machine reaches. */
  hostAddress: string;
  /** The machine's own address. */
  address: string;
}

function ip(args: string[]): { ok: boolean; output: string } {
  const r = spawnSync('ip', args, { encoding: 'utf8' });
  return { ok: r.status === 0, output: `${r.stdout ?? ''}${r.stderr ?? ''}${r.error ? r.error.message : ''}`.trim() };
}

function mustIp(args: string[]): void {
  const r = ip(args);
  if (!r.ok) throw new Error(`ip ${args.join(' ')} failed: ${r.output}`);
}

/** Why namespaces cannot be made here, or null when they can (it tries one). */
export function namespacesUnavailable(): string | null {
  if (process.getuid?.() !== 0) return 'network namespaces need root (the test runs as another user)';
  if (!ip(['-V']).ok) return "the 'ip' command (Debian package iproute2) is not installed";
  const probe = `sfy-t-${process.pid}-probe`;
  const added = ip(['netns', 'add', probe]);
  if (!added.ok) return `'ip netns add' is not permitted here: ${added.output}`;
  ip(['netns', 'del', probe]);
  return null;
}

/** A third octet of 10.231.x.0 that no address on this host uses yet. */
function freeSubnet(): number {
  const used = ip(['-4', '-o', 'addr', 'show']).output;
  for (let i = 0; i < 256; i++) {
    const x = (process.pid + i) % 256;
    if (!used.includes(`10.231.${x}.`)) return x;
  }
  throw new Error('no free 10.231.x.0/24 for the test namespaces');
}

export class Machines {
  private readonly made: { netns: string; hostLink: string }[] = [];
  private readonly subnet = freeSubnet();

  /** Creates the namespace `sfy-t-<pid>-<name>` with its link; `index` picks its /30 (0..63). */
  add(name: string, index: number): Machine {
    const netns = `sfy-t-${process.pid}-${name}`;
    // Interface names are at most 15 characters.
    const hostLink = `sf${process.pid}${name.slice(0, 1)}h`;
    const nsLink = `sf${process.pid}${name.slice(0, 1)}n`;
    const base = `10.231.${this.subnet}.`;
    const hostAddress = `${base}${index * 4 + 1}`;
    const address = `${base}${index * 4 + 2}`;
    mustIp(['netns', 'add', netns]);
    this.made.push({ netns, hostLink });
    mustIp(['link', 'add', hostLink, 'type', 'veth', 'peer', 'name', nsLink, 'netns', netns]);
    mustIp(['addr', 'add', `${hostAddress}/30`, 'dev', hostLink]);
    mustIp(['link', 'set', hostLink, 'up']);
    mustIp(['-n', netns, 'addr', 'add', `${address}/30`, 'dev', nsLink]);
    mustIp(['-n', netns, 'link', 'set', nsLink, 'up']);
    mustIp(['-n', netns, 'link', 'set', 'lo', 'up']);
    return { netns, hostAddress, address };
  }

  /** Removes every namespace and link made here (deleting either end of a veth pair removes both). */
  removeAll(): void {
    for (const { netns, hostLink } of this.made.splice(0)) {
      ip(['link', 'del', hostLink]);
      ip(['netns', 'del', netns]);
    }
  }
}
