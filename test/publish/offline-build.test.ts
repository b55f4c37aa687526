// `cellbasis build` needs no network: the whole build (HTML of every draft and issued revision,
// the index, the assets, and the draft PDFs printed in Chromium) runs as a child process with
// all network access taken away, in two independent ways, and still writes the complete site.
//
//   1. A preload (test/helpers/fixtures/no-network.mjs, through NODE_OPTIONS=--import, so
//      worker threads get it too) refuses and records every network call of Node: socket
//      connects (TCP, TLS, http, https, http2, the fetch built into Node), http(s).request,
//      DNS lookups and resolves, UDP and the global fetch. It also records every request the
//      pages of the printer's Chromium make and has Chromium write its NetLog, which shows
//      whatever Chromium itself sends (TCP connection attempts, bytes, DNS transactions, proxy
//      connections). The proxy variables point at a local recording server, so that a request
//      Chromium sends through a proxy arrives there.
//      The controls show each part works: the same Node calls reach that server without the
//      preload and are refused and recorded with it; Chromium without its OFFLINE_ARGS
//      (lib/publish/pdf.ts) sends a page's requests, and requests of its own
//      (update.googleapis.com, accounts.google.com), to the proxy, and its NetLog shows the
//      traffic; with the printer's arguments, nothing reaches anything and the NetLog shows no
//      traffic; the printer, which also aborts every request of a page but file: and data:,
//      prints a page asking for web addresses without anything arriving anywhere.
//   2. Where `unshare -n` (as root) or `unshare -rn` is permitted, the build runs in a network
//      namespace of its own, whose only interface is a loopback that is down (a control shows
//      a connection to the test's server fails from inside it), without the preload. Where
//      unshare is refused, this variant is skipped with a message saying so.
//
// Each build must exit 0 and write every page, each draft's document.pdf and the assets, with
// every file a page loads inside the site; no network attempt of Node may be recorded, the
// printed pages may load only file: and data: URLs, and Chromium may send nothing at all (its
// own requests fail inside it, for want of a proxy and a resolvable name). Chromium is needed
// (describeWithChromium: skipped locally without it, run whenever CI is set).
//
// A failed connect() of a UDP socket to [2001:4860:4860::8888]:443 in the NetLog is Chromium's
// IPv6 reachability check: it asks the routing table and sends nothing, so it is not traffic.
import { spawnSync } from 'node:child_process';
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo, Socket } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { announceChromiumSkip, describeWithChromium } from '../helpers/chromium.ts';
import { demoRoot, EPOCH, htmlPages, issueFixture } from '../helpers/site.ts';
import { treeDigest } from '../helpers/tree-digest.ts';
import { cellbasis, expectCompleteSite, runNode, type ChildRun } from '../helpers/child-process.ts';

announceChromiumSkip('the offline build tests');

const PRELOAD = fileURLToPath(new URL('../helpers/fixtures/no-network.mjs', import.meta.url));
const ATTEMPTS = fileURLToPath(new URL('../helpers/fixtures/network-attempts.mjs', import.meta.url));
const PROJECTS = ['hob-tor-pem-backup', 'kestrelford-pem-electrolyser'] as const;
const ISSUED_PAGE = 'projects/hob-tor-pem-backup/rev-A/index.html';
/** The issued document itself, which the site carries beside its revision's register page. */
const ISSUED_DOCUMENT = 'projects/hob-tor-pem-backup/rev-A/document.html';
const BUILD_TIMEOUT = 400_000;

/** The unshare arguments that give a process a network namespace of its own here, or null. */
function unshareArgs(): { args: string[] | null; why: string } {
  const candidates = process.getuid?.() === 0 ? [['-n'], ['-rn']] : [['-rn']];
  const refusals: string[] = [];
  for (const args of candidates) {
    const r = spawnSync('unshare', [...args, 'true'], { encoding: 'utf8' });
    if (r.status === 0) return { args, why: '' };
    refusals.push(`unshare ${args.join(' ')}: ${(r.error?.message ?? r.stderr).trim() || `exit ${r.status}`}`);
  }
  return { args: null, why: refusals.join('; ') };
}

const UNSHARE = unshareArgs();
if (!UNSHARE.args) console.warn(`\n*** SKIPPED the offline build in a network namespace: unshare is not permitted here (${UNSHARE.why}); the preload variant still runs ***\n`);

interface LogEntry {
  pid: number;
  thread: number;
  kind: 'loaded' | 'attempt' | 'ipc' | 'page-request' | 'netlog' | 'note';
  detail: string;
}

function readLog(file: string): LogEntry[] {
  return readFileSync(file, 'utf8').split('\n').filter(Boolean).map((line) => JSON.parse(line) as LogEntry);
}

/** NetLog events that mean something went out: a TCP connection attempt, bytes or packets sent, a DNS transaction or lookup task, a proxy connection. */
const TRAFFIC = /CONNECT_ATTEMPT|BYTES_SENT|PACKET_SENT|DNS_TRANSACTION|DNS_TASK|SYSTEM_TASK|PROXY_CONNECT_JOB/;

interface NetLogEvent {
  type: number;
  phase?: number;
  source: { id: number };
  params?: { url?: string; net_error?: number; address?: string };
}

/** What a Chromium NetLog (possibly cut short) shows: the traffic events, and each URL request with how it ended. */
function readNetLog(file: string): { traffic: string[]; requests: { url: string; netError: number | undefined }[] } {
  const text = readFileSync(file, 'utf8');
  let log: { constants: { logEventTypes: Record<string, number> }; events: NetLogEvent[] };
  try {
    log = JSON.parse(text);
  } catch {
    log = JSON.parse(`${text.trimEnd().replace(/,$/, '')}]}`);
  }
  const names = new Map(Object.entries(log.constants.logEventTypes).map(([name, id]) => [id, name]));
  const traffic: string[] = [];
  const requests = new Map<number, { url: string; netError: number | undefined }>();
  for (const event of log.events) {
    const name = names.get(event.type) ?? String(event.type);
    if (TRAFFIC.test(name)) traffic.push(`${name} ${JSON.stringify(event.params ?? {})}`);
    if (name !== 'URL_REQUEST_START_JOB') continue;
    if (event.params?.url) requests.set(event.source.id, { url: event.params.url, netError: undefined });
    else if (event.params?.net_error !== undefined) {
      const request = requests.get(event.source.id);
      if (request) request.netError = event.params.net_error;
    }
  }
  return { traffic, requests: [...requests.values()] };
}

/** The NetLogs the preload had Chromium write, read. */
function netLogsOf(entries: LogEntry[]): ReturnType<typeof readNetLog>[] {
  return entries.filter((e) => e.kind === 'netlog').map((e) => readNetLog(e.detail));
}

/** A local HTTP server (and proxy: it answers whatever it is asked) that records every connection and request. */
class Recorder {
  readonly connections: string[] = [];
  readonly requests: string[] = [];
  private server!: Server;
  private readonly sockets = new Set<Socket>();

  async start(): Promise<number> {
    this.server = createServer((req, res) => {
      this.requests.push(`${req.method} ${req.url} (Host: ${req.headers.host})`);
      res.end('recorded');
    });
    this.server.on('connection', (socket) => {
      this.connections.push(`${socket.remoteAddress}:${socket.remotePort}`);
      this.sockets.add(socket);
      socket.on('close', () => this.sockets.delete(socket));
    });
    // Requests through the proxy for https: arrive as CONNECT.
    this.server.on('connect', (req, socket) => {
      this.requests.push(`CONNECT ${req.url}`);
      socket.end('HTTP/1.1 403 Forbidden\r\n\r\n');
    });
    await new Promise<void>((resolve) => this.server.listen(0, '127.0.0.1', resolve));
    return this.port;
  }

  get port(): number {
    return (this.server.address() as AddressInfo).port;
  }

  /** What arrived since `mark()` returned. */
  mark(): () => { connections: string[]; requests: string[] } {
    const [c, r] = [this.connections.length, this.requests.length];
    return () => ({ connections: this.connections.slice(c), requests: this.requests.slice(r) });
  }

  async stop(): Promise<void> {
    for (const socket of this.sockets) socket.destroy();
    await new Promise((resolve) => this.server.close(resolve));
  }
}

/** Runs node with `args`, optionally behind `wrapper`. */
function node(args: string[], env: Record<string, string>, wrapper: string[] = []): Promise<ChildRun> {
  return runNode(args, tmpdir(), { env, wrapper });
}

/** Every proxy variable Chromium (and most tools) read, pointed at the recorder. */
function proxiesTo(port: number): Record<string, string> {
  const proxy = `http://127.0.0.1:${port}`;
  return Object.fromEntries(['http_proxy', 'https_proxy', 'all_proxy', 'HTTP_PROXY', 'HTTPS_PROXY', 'ALL_PROXY'].map((name) => [name, proxy]));
}

/** The demo projects of the test, one with an issued revision. */
async function offlineRoot(): Promise<string> {
  const root = demoRoot(PROJECTS);
  await issueFixture(root, 'hob-tor-pem-backup', 'A', 'issued for review', '2026-06-02');
  return root;
}

function expectBuilt(r: ChildRun): void {
  // The demos' own findings (a basis line with their severity, "critical:", "warning:" or "info:")
  // belong to their documents; anything else on stderr, such as PDFs not printed, is a failure of
  // the offline build.
  const other = r.err.split('\n').filter((line) => line !== '' && !/^projects\/[a-z0-9-]+\/basis\.yaml:\d+:\d+: (critical|warning|info): /.test(line));
  expect(other, 'no warning, such as PDFs not printed').toEqual([]);
  expect(r.out).toBe(`built 3 document pages and 2 draft PDFs and the index into site/\n`);
  expect(r.code).toBe(0);
}

describeWithChromium('cellbasis build with all network access taken away', () => {
  const recorder = new Recorder();
  const roots: string[] = [];
  const scratch = () => {
    const root = demoRoot([]);
    roots.push(root);
    return root;
  };
  /** Pages of the preload build, compared with the namespace build's. */
  let preloadPages: Record<string, string> | null = null;

  beforeAll(async () => {
    await recorder.start();
  });

  afterAll(async () => {
    await recorder.stop();
    for (const root of roots) rmSync(root, { recursive: true, force: true });
  });

  /** A page that asks for web addresses by name and by number (the recorder's), for the controls. */
  function askingPage(dir: string): string {
    const page = join(dir, 'asks-the-web.html');
    const here = `http://127.0.0.1:${recorder.port}`;
    writeFileSync(page, `<!doctype html><html><head><link rel="stylesheet" href="http://cellbasis-control.invalid/style.css"><script src="https://cellbasis-control.invalid/x.js"></script></head><body><p>offline</p><img src="${here}/img.png"></body></html>`);
    return page;
  }

  it('control: Node\'s network calls reach the local server without the preload; with it each is refused and recorded', { timeout: 120_000 }, async () => {
    const dir = scratch();
    const without = recorder.mark();
    const free = JSON.parse((await node([ATTEMPTS, String(recorder.port)], {})).out) as Record<string, string>;
    expect(Object.keys(free).length).toBeGreaterThanOrEqual(11);
    for (const [name, outcome] of Object.entries(free)) expect(outcome, `${name} without the preload`).toBe('connected');
    expect(without().connections.length, 'the TCP calls reached the server').toBeGreaterThanOrEqual(7);

    const log = join(dir, 'net.log');
    const withPreload = recorder.mark();
    const refused = JSON.parse((await node(['--import', PRELOAD, ATTEMPTS, String(recorder.port)], { CELLBASIS_NET_LOG: log })).out) as Record<string, string>;
    expect(Object.keys(refused)).toEqual(Object.keys(free));
    for (const [name, outcome] of Object.entries(refused)) expect(outcome, `${name} with the preload`).toMatch(/^failed: ENETUNREACH .*refused by test\/helpers\/fixtures\/no-network\.mjs/);
    expect(withPreload(), 'nothing reached the server').toEqual({ connections: [], requests: [] });
    const entries = readLog(log);
    expect(entries[0]).toMatchObject({ kind: 'loaded' });
    expect(entries.filter((e) => e.kind === 'attempt')).toHaveLength(Object.keys(refused).length);
  });

  it('control: Chromium sends requests (its own and a page\'s) through the proxy, and its NetLog shows them, unless launched with the printer\'s arguments', { timeout: 400_000 }, async () => {
    const dir = scratch();
    const page = askingPage(dir);
    const browse = async (variant: 'online' | 'offline') => {
      const log = join(dir, `browse-${variant}.log`);
      const arrived = recorder.mark();
      const outcome = JSON.parse((await node(['--import', PRELOAD, ATTEMPTS, String(recorder.port), '--browse', pathToFileURL(page).href, variant], { CELLBASIS_NET_LOG: log, ...proxiesTo(recorder.port) })).out) as Record<string, string>;
      expect(outcome.browse, variant).toBe('connected');
      const entries = readLog(log);
      expect(entries.filter((e) => e.kind === 'page-request').map((e) => e.detail), `${variant}: the probe sees what the page asks for`).toEqual(
        expect.arrayContaining([`file://${page}`, 'http://cellbasis-control.invalid/style.css', 'https://cellbasis-control.invalid/x.js', `http://127.0.0.1:${recorder.port}/img.png`]),
      );
      return { arrived: arrived(), netLogs: netLogsOf(entries) };
    };

    const online = await browse('online');
    expect(online.arrived.requests, 'the page\'s requests arrive, by proxy and directly').toEqual(expect.arrayContaining(['GET http://cellbasis-control.invalid/style.css (Host: cellbasis-control.invalid)', 'CONNECT cellbasis-control.invalid:443', `GET /img.png (Host: 127.0.0.1:${recorder.port})`]));
    const own = online.arrived.requests.filter((r) => !r.includes('cellbasis-control.invalid') && !r.includes('/img.png'));
    console.info(`control: Chromium without OFFLINE_ARGS asked, of its own accord: ${own.join('; ') || 'nothing this time'}`);
    expect(online.netLogs).toHaveLength(1);
    expect(online.netLogs[0]!.traffic.some((t) => t.startsWith('TCP_CONNECT_ATTEMPT')), 'the NetLog shows the traffic').toBe(true);

    const offline = await browse('offline');
    expect(offline.arrived, 'with the printer\'s arguments nothing arrives').toEqual({ connections: [], requests: [] });
    expect(offline.netLogs).toHaveLength(1);
    expect(offline.netLogs[0]!.traffic, 'and the NetLog shows no traffic').toEqual([]);
    const web = offline.netLogs[0]!.requests.filter((r) => !/^(file|data):/.test(r.url));
    expect(web.map((r) => r.url)).toEqual(expect.arrayContaining(['http://cellbasis-control.invalid/style.css']));
    for (const r of web) expect(r.netError, `${r.url} failed inside Chromium`).toBeLessThan(0);
  });

  it('control: the printer prints a page that asks for web addresses, and nothing arrives anywhere', { timeout: 400_000 }, async () => {
    const dir = scratch();
    const page = askingPage(dir);
    const log = join(dir, 'print.log');
    const arrived = recorder.mark();
    const outcome = JSON.parse((await node(['--import', PRELOAD, ATTEMPTS, String(recorder.port), '--print', page], { CELLBASIS_NET_LOG: log, ...proxiesTo(recorder.port) })).out) as Record<string, string>;
    expect(outcome.print).toBe('connected');
    expect(arrived()).toEqual({ connections: [], requests: [] });
    const entries = readLog(log);
    expect(entries.filter((e) => e.kind === 'page-request').map((e) => e.detail)).toEqual(expect.arrayContaining([`file://${page}`, 'http://cellbasis-control.invalid/style.css', `http://127.0.0.1:${recorder.port}/img.png`]));
    expect(netLogsOf(entries).flatMap((n) => n.traffic)).toEqual([]);
  });

  it('builds every page, PDF and asset with the preload refusing every network call: none attempted, pages load only file: and data:, Chromium sends nothing', { timeout: BUILD_TIMEOUT }, async () => {
    const root = await offlineRoot();
    roots.push(root);
    const log = join(root, 'net.log');
    writeFileSync(log, '');
    const during = recorder.mark();
    // NODE_OPTIONS is split at spaces: the preload goes as a file: URL, whose spaces are escaped, so a checkout path with a space works.
    const r = await cellbasis(['build'], root, { env: { ...EPOCH, NODE_OPTIONS: `--import=${pathToFileURL(PRELOAD).href}`, CELLBASIS_NET_LOG: log, ...proxiesTo(recorder.port) } });
    console.info(`offline build (preload): ${(r.ms / 1000).toFixed(1)} s`);
    expectBuilt(r);
    const site = join(root, 'site');
    expectCompleteSite(site, PROJECTS, [ISSUED_PAGE]);
    expect(htmlPages(site)).toEqual(['index.html', ...PROJECTS.map((id) => `projects/${id}/index.html`), ISSUED_PAGE, ISSUED_DOCUMENT].sort());

    const entries = readLog(log);
    expect(entries.some((e) => e.kind === 'loaded' && e.thread === 0 && e.detail.includes('cellbasis.js build')), 'the preload ran in the build').toBe(true);
    expect(entries.filter((e) => e.kind === 'attempt' || e.kind === 'note'), 'network attempts').toEqual([]);
    // tsx's loader asks for its parent tsx process's pipe (there is none); nothing else connects anywhere.
    for (const e of entries.filter((x) => x.kind === 'ipc')) expect(e.detail).toMatch(/\/tsx-\d+\/\d+\.pipe$/);
    const requests = entries.filter((e) => e.kind === 'page-request').map((e) => e.detail);
    for (const id of PROJECTS) expect(requests.some((u) => u.startsWith('file://') && u.endsWith(`/projects/${id}/index.html`)), `the print of ${id} was watched`).toBe(true);
    expect(requests.filter((u) => !/^(file|data):/.test(u)), 'requests of the printed pages outside file: and data:').toEqual([]);
    const netLogs = netLogsOf(entries);
    expect(netLogs.length, 'the printer\'s Chromium wrote its NetLog').toBeGreaterThanOrEqual(1);
    expect(netLogs.flatMap((n) => n.traffic), 'traffic of Chromium').toEqual([]);
    const own = netLogs.flatMap((n) => n.requests).filter((q) => !/^(file|data):/.test(q.url));
    for (const q of own) expect(q.netError, `${q.url} failed inside Chromium`).toBeLessThan(0);
    console.info(`offline build: Chromium's own requests, each failed inside it: ${own.map((q) => new URL(q.url).host).join(', ') || 'none'}`);
    expect(during(), 'nothing reached the proxy').toEqual({ connections: [], requests: [] });
    preloadPages = Object.fromEntries(Object.entries(treeDigest(site)).filter(([path]) => path.endsWith('.html')));
  });

  it.skipIf(!UNSHARE.args)(`builds every page, PDF and asset in a network namespace without interfaces (unshare ${UNSHARE.args?.join(' ') ?? '-n'})`, { timeout: BUILD_TIMEOUT }, async () => {
    const wrapper = ['unshare', ...UNSHARE.args!];
    // Control: inside, the only interface is the loopback, down, and the test's server is out of reach.
    const inside = await node(['-e', "process.stdout.write(require('fs').readFileSync('/proc/net/dev', 'utf8'))"], {}, wrapper);
    expect(inside.out.split('\n').slice(2).filter(Boolean).map((line) => line.trim().split(':')[0])).toEqual(['lo']);
    const reach = recorder.mark();
    const attempts = JSON.parse((await node([ATTEMPTS, String(recorder.port)], {}, wrapper)).out) as Record<string, string>;
    for (const name of ['net.connect', 'http.get', 'fetch']) expect(attempts[name], name).toMatch(/^failed: .*(ENETUNREACH|ECONNREFUSED)/);
    expect(reach().connections).toEqual([]);

    const root = await offlineRoot();
    roots.push(root);
    const r = await cellbasis(['build'], root, { env: { ...EPOCH }, wrapper });
    console.info(`offline build (network namespace): ${(r.ms / 1000).toFixed(1)} s`);
    expectBuilt(r);
    const site = join(root, 'site');
    expectCompleteSite(site, PROJECTS, [ISSUED_PAGE]);
    const pages = Object.fromEntries(Object.entries(treeDigest(site)).filter(([path]) => path.endsWith('.html')));
    if (preloadPages) expect(pages, 'the same pages as the build with the preload').toEqual(preloadPages);
  });
});
