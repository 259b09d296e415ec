// Private MariaDB and Redis for development and tests, started as child processes of the
// calling script so that Ctrl-C stops them too. Plain Node with no dependencies: it runs
// before `npm ci` has installed anything.
import { spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, openSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { log, fail } from './output.mjs';

// Debian puts the server binaries in sbin, which a non-login shell may not have on PATH.
for (const dir of ['/usr/sbin', '/sbin']) {
  if (!(process.env.PATH ?? '').split(':').includes(dir)) process.env.PATH = `${process.env.PATH}:${dir}`;
}

function commandExists(name) {
  return spawnSync('sh', ['-c', `command -v ${name}`], { stdio: 'ignore' }).status === 0;
}

/**
 * Installs the Debian packages that are missing; `wanted` maps what proves a package is there
 * (a command name, or an absolute path) to the package name.
 */
export function ensureDebianPackages(wanted) {
  const present = (probe) => (probe.startsWith('/') ? existsSync(probe) : commandExists(probe));
  const missing = Object.entries(wanted).filter(([probe]) => !present(probe)).map(([, pkg]) => pkg);
  if (missing.length === 0) return;
  log(`installing Debian packages: ${missing.join(' ')}`);
  const asRoot = process.getuid?.() === 0;
  if (!asRoot && !commandExists('sudo')) {
    fail(`missing ${missing.join(', ')}; install them (apt-get install ${missing.join(' ')}) or run as root`);
  }
  const prefix = asRoot ? [] : ['sudo', '-n'];
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const run = (args) => {
    const [cmd, ...rest] = [...prefix, ...args];
    const result = spawnSync(cmd, rest, { stdio: ['ignore', 'ignore', 'inherit'], env });
    if (result.status !== 0) fail(`'${args.join(' ')}' failed (exit ${result.status})`);
  };
  run(['apt-get', 'update', '-q']);
  run(['apt-get', '-o', 'DPkg::Lock::Timeout=600', 'install', '-y', '-q', '--no-install-recommends', ...missing]);
}

export function portIsFree(port, host = '127.0.0.1') {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.once('error', () => resolve(false));
    server.listen(port, host, () => server.close(() => resolve(true)));
  });
}

async function waitUntil(check, what, timeoutMs, logFile) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (check()) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  const tail = logFile && existsSync(logFile) ? readFileSync(logFile, 'utf8').split('\n').slice(-15).join('\n') : '';
  fail(`${what} did not answer within ${timeoutMs / 1000} s${tail ? `; end of ${logFile}:\n${tail}` : ''}`);
}

/** Unix sockets allow ~107 bytes; a deep checkout moves the socket under the temp folder. */
function socketPath(dataDir) {
  const inTree = path.join(dataDir, 'run', 'mysqld.sock');
  if (inTree.length < 100) return inTree;
  const short = path.join(os.tmpdir(), `sixtyfold-${createHash('sha1').update(dataDir).digest('hex').slice(0, 10)}`);
  mkdirSync(short, { recursive: true });
  return path.join(short, 'mysqld.sock');
}

/**
 * Starts a private MariaDB server in `dir` on `port` of the `bind` addresses (127.0.0.1 by
 * default) and makes sure `database` and its user exist, allowed in from `clientHosts` (MariaDB
 * host patterns); `serverArgs` are added to mariadbd's (TLS files, for instance). Returns the
 * child process (or null when one of ours was already running).
 */
/**
 * InnoDB's buffer pool: an eighth of the machine's memory, from 256 MiB to 4 GiB. A scan of 10^6
 * points with its indexes is ~0.7 GB; once they no longer fit, every insert into a secondary index
 * reads a page from disk, and storing a chunk went from ~90 to ~370 ms (`npm run bench -- million`).
 */
function bufferPoolMiB() {
  return Math.min(4096, Math.max(256, Math.floor(os.totalmem() / 8 / 2 ** 20)));
}

export async function startMariaDb({
  dir: givenDir, port, database, user, password, freshDatabase = false, bind = ['127.0.0.1'], clientHosts = ['127.0.0.1'], serverArgs = [],
}) {
  const dir = path.resolve(givenDir);
  const dataDir = path.join(dir, 'data');
  mkdirSync(path.join(dir, 'run'), { recursive: true });
  const socket = socketPath(dir);
  const errorLog = path.join(dir, 'error.log');
  const client = (sql) =>
    spawnSync('mariadb', ['--no-defaults', `--socket=${socket}`, '-uroot', '-e', sql], { encoding: 'utf8' });
  const ping = () =>
    spawnSync('mariadb-admin', ['--no-defaults', `--socket=${socket}`, '-uroot', '--silent', 'ping'], { stdio: 'ignore' })
      .status === 0;

  let child = null;
  if (ping()) {
    log(`MariaDB already running from ${dir}; reusing it`);
  } else {
    if (!(await portIsFree(port))) fail(`port ${port} is taken by another program; set DATABASE_PORT_LOCAL or stop it`);
    if (!existsSync(path.join(dataDir, 'mysql'))) {
      log(`creating MariaDB data folder ${dataDir}`);
      const install = spawnSync('mariadb-install-db', [
        '--no-defaults', `--user=${os.userInfo().username}`, `--datadir=${dataDir}`,
        '--auth-root-authentication-method=socket', '--skip-test-db',
      ], { encoding: 'utf8' });
      if (install.status !== 0) fail(`mariadb-install-db failed:\n${install.stdout}\n${install.stderr}`);
    }
    const out = openSync(errorLog, 'a');
    child = spawn('mariadbd', [
      '--no-defaults', `--user=${os.userInfo().username}`, `--datadir=${dataDir}`,
      `--bind-address=${bind.join(',')}`, `--port=${port}`, `--socket=${socket}`,
      `--pid-file=${path.join(dir, 'run', 'mysqld.pid')}`, `--log-error=${errorLog}`,
      '--skip-name-resolve', '--character-set-server=utf8mb4', '--collation-server=utf8mb4_unicode_ci',
      `--innodb-buffer-pool-size=${bufferPoolMiB()}M`, '--innodb-log-file-size=512M', '--max-connections=300', ...serverArgs,
    ], { stdio: ['ignore', out, out], detached: true });
    child.once('exit', (code) => { if (code) log(`MariaDB exited with ${code}; see ${errorLog}`); });
    await waitUntil(ping, 'MariaDB', 60_000, errorLog);
  }
  const drop = freshDatabase ? `DROP DATABASE IF EXISTS \`${database}\`;` : '';
  const grants = clientHosts.map((host) =>
    ` CREATE USER IF NOT EXISTS '${user}'@'${host}' IDENTIFIED BY '${password}';` +
      ` ALTER USER '${user}'@'${host}' IDENTIFIED BY '${password}';` +
      ` GRANT ALL ON \`${database}\`.* TO '${user}'@'${host}';`);
  const setup = client(
    `${drop} CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;${grants.join('')}`,
  );
  if (setup.status !== 0) fail(`could not create database ${database}: ${setup.stderr}`);
  const pidFile = path.join(dir, 'run', 'mysqld.pid');
  return { child, socket, stop: () => stopByPidFile(pidFile, 'MariaDB') };
}

/**
 * Starts a private Redis in `dir` on `port` of the `bind` addresses (127.0.0.1 by default),
 * append-only so queued work survives a restart. With `acl` ({ user, password, rules }) the
 * `default` user is switched off and only that user, with those ACL rules, may sign in;
 * `serverArgs` are added to redis-server's (a TLS port, for instance).
 */
export async function startRedis({ dir: givenDir, port, flush = false, bind = ['127.0.0.1'], acl = null, serverArgs = [] }) {
  const dir = path.resolve(givenDir);
  mkdirSync(dir, { recursive: true });
  const logFile = path.join(dir, 'redis.log');
  // The password goes through the environment, where redis-cli reads it without a warning.
  const cli = (args) => spawnSync('redis-cli', ['-h', '127.0.0.1', '-p', String(port), ...(acl ? ['--user', acl.user] : []), ...args], {
    encoding: 'utf8', env: acl ? { ...process.env, REDISCLI_AUTH: acl.password } : process.env,
  });
  const ping = () => cli(['ping']).stdout?.trim() === 'PONG';
  let child = null;
  if (ping()) {
    log(`Redis already answering on ${port}; reusing it`);
  } else {
    if (!(await portIsFree(port))) fail(`port ${port} is taken by another program; stop it or choose another REDIS_PORT_LOCAL`);
    child = spawn('redis-server', [
      '--bind', ...bind, '--port', String(port), '--dir', dir,
      ...(acl ? ['--user', 'default', 'off', '--user', acl.user, 'on', `>${acl.password}`, ...acl.rules] : []),
      '--appendonly', 'yes', '--appenddirname', 'aof', '--appendfsync', 'everysec', '--save', '',
      '--logfile', logFile, '--pidfile', path.join(dir, 'redis.pid'), '--daemonize', 'no', ...serverArgs,
    ], { stdio: 'ignore', detached: true });
    child.once('exit', (code) => { if (code) log(`Redis exited with ${code}; see ${logFile}`); });
    await waitUntil(ping, 'Redis', 30_000, logFile);
  }
  if (flush) cli(['flushall']);
  return { child, stop: () => stopByPidFile(path.join(dir, 'redis.pid'), 'Redis') };
}

/**
 * Starts the local SMTP mail catcher (deploy/scripts/mail-catcher.mjs) on 127.0.0.1:`port`,
 * storing messages in `dir`. Needs the npm packages, so it starts after `npm ci`.
 */
export async function startMailCatcher({ dir: givenDir, port, empty = false }) {
  const dir = path.resolve(givenDir);
  if (empty) rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  const pidFile = path.join(dir, '..', 'mail-catcher.pid');
  const logFile = path.join(dir, '..', 'mail-catcher.log');
  await stopByPidFile(pidFile, 'the mail catcher'); // one left over from an earlier run
  if (!(await portIsFree(port))) fail(`port ${port} is taken by another program; stop it or choose another SIXTYFOLD_SMTP_PORT`);
  const out = openSync(logFile, 'a');
  const script = fileURLToPath(new URL('../mail-catcher.mjs', import.meta.url));
  const child = spawn(process.execPath, [script, '--port', String(port), '--dir', dir], { stdio: ['ignore', out, out], detached: true });
  writeFileSync(pidFile, String(child.pid));
  let listening = false;
  const probe = () => {
    const socket = net.connect(port, '127.0.0.1', () => { listening = true; socket.destroy(); });
    socket.once('error', () => socket.destroy());
  };
  await waitUntil(() => { if (!listening) probe(); return listening || child.exitCode !== null; }, 'the mail catcher', 30_000, logFile);
  if (child.exitCode !== null) fail(`the mail catcher exited with ${child.exitCode}; see ${logFile}`);
  return { child, stop: () => stopByPidFile(pidFile, 'the mail catcher') };
}

/** SIGTERM, then SIGKILL after a grace period; resolves when the process has gone. */
export function stopChild(child, name, graceMs = 15_000) {
  if (!child || child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const timer = setTimeout(() => { log(`${name} did not stop in time; killing it`); child.kill('SIGKILL'); }, graceMs);
    child.once('exit', () => { clearTimeout(timer); resolve(); });
    child.kill('SIGTERM');
  });
}

/**
 * Whether a process still runs. A server that has exited stays a zombie until its parent reaps
 * it, and a parent busy in spawnSync (test.mjs running a suite) reaps nothing: that counts as gone.
 */
export function isAlive(pid) {
  try {
    process.kill(pid, 0);
  } catch {
    return false;
  }
  try {
    // /proc/<pid>/stat: "pid (name) state …"; the name may hold spaces, so read after the last ')'.
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    return stat.slice(stat.lastIndexOf(')') + 2, stat.lastIndexOf(')') + 3) !== 'Z';
  } catch {
    return true; // no /proc: the signal check is all we have
  }
}

/**
 * Stops a server by the pid it wrote, which also covers one left running by an earlier start.
 * The services run in their own process group, so Ctrl-C reaches them only through here,
 * after the API and the workers have let go of them.
 */
export async function stopByPidFile(pidFile, name, graceMs = 30_000) {
  if (!existsSync(pidFile)) return;
  const pid = Number(readFileSync(pidFile, 'utf8').trim());
  if (!pid || !isAlive(pid)) return;
  process.kill(pid, 'SIGTERM');
  const deadline = Date.now() + graceMs;
  while (isAlive(pid) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
  if (isAlive(pid)) {
    log(`${name} did not stop within ${graceMs / 1000} s; killing it`);
    process.kill(pid, 'SIGKILL');
  }
}

export function removeFolder(dir) {
  rmSync(dir, { recursive: true, force: true });
}

/** The Debian packages a profile needs: only for the services it runs itself. */
export function profilePackages(profile) {
  return {
    ...(profile.manageDb ? { mariadbd: 'mariadb-server' } : {}),
    ...(profile.manageRedis ? { 'redis-server': 'redis-server' } : {}),
  };
}

/**
 * Starts the MariaDB, Redis and mail catcher a profile runs itself (none where it points at
 * existing servers). `fresh` recreates the database and empties Redis and the caught mail.
 * Returns the started services, to stop in reverse order.
 */
export async function startProfileServices(profile, { fresh = false } = {}) {
  const services = [];
  if (profile.manageDb) {
    log(`starting MariaDB on 127.0.0.1:${profile.dbPort}${fresh ? ` (fresh database ${profile.database})` : ''}`);
    services.push(await startMariaDb({
      dir: path.join(profile.dataDir, 'mariadb'), port: profile.dbPort, database: profile.database,
      user: profile.dbUser, password: profile.dbPassword, freshDatabase: fresh,
    }));
  }
  if (profile.manageRedis) {
    log(`starting Redis on 127.0.0.1:${profile.redisPort}${fresh ? ' (emptied)' : ''}`);
    services.push(await startRedis({ dir: path.join(profile.dataDir, 'redis'), port: profile.redisPort, flush: fresh }));
  }
  if (profile.manageMail) {
    log(`starting the mail catcher (SMTP) on 127.0.0.1:${profile.smtpPort}${fresh ? ' (emptied)' : ''}`);
    services.push(await startMailCatcher({ dir: profile.mailDir, port: profile.smtpPort, empty: fresh }));
  }
  return services;
}
