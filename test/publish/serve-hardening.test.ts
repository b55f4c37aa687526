// cellbasis serve against what a day of editing and a careless network do to it (issue 15 item 2,
// issue 21 item 2; the serve part of the hostile corpus, class "serve"): it listens on this machine
// only; a malformed request path gets 400 or 404 and the server goes on; every way an editor saves
// a basis is rebuilt (rename over it, truncate and write, delete and write again, a new project
// folder), also after a save by rename, which a watch on the file itself loses; a project renamed,
// deleted or broken never stops it; a taken port is replaced by the next free one, and said; an
// issued revision's PDF is served beside its page.
import { closeSync, ftruncateSync, mkdirSync, openSync, readFileSync, renameSync, rmSync, writeFileSync, writeSync } from 'node:fs';
import { request } from 'node:http';
import { createServer, type Server } from 'node:net';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { requestPathProblem, serveSite, type RunningServer } from '../../lib/publish/serve.ts';
import { basisFile, demoRoot, freePort, issueFixture } from '../helpers/site.ts';
import { run } from '../helpers/run-cli.ts';

const ID = 'hob-tor-pem-backup';
const TITLE = '8 kW PEM backup power unit';
let root: string;
let server: RunningServer;
let good: string;

/** GET with the path sent exactly as written (fetch would normalise it): status and body. */
function get(path: string, host = '127.0.0.1', port = server.port): Promise<{ status: number; body: string }> {
  return new Promise((resolve, reject) => {
    const req = request({ host, port, path, method: 'GET' }, (res) => {
      let body = '';
      res.setEncoding('latin1');
      res.on('data', (c: string) => (body += c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body }));
    });
    req.on('error', reject);
    req.end();
  });
}

/** Polls a page until `test` holds (a rebuild takes a moment), at most 30 s; the last body. */
async function until(path: string, test: (html: string) => boolean): Promise<string> {
  let html = '';
  for (let i = 0; i < 60; i++) {
    html = await get(path).then((r) => r.body, () => '');
    if (test(html)) return html;
    await new Promise((r) => setTimeout(r, 500));
  }
  return html;
}

const titled = (n: number) => good.replace(`title: ${TITLE}`, `title: ${n} kW PEM backup power unit`);

beforeAll(async () => {
  root = demoRoot([ID]);
  await issueFixture(root, ID, 'A', 'issued for review', '2026-06-02');
  good = readFileSync(basisFile(root, ID), 'utf8');
  server = await serveSite({ root, port: await freePort() });
}, 120_000);

afterAll(async () => {
  await server?.stop();
  rmSync(root, { recursive: true, force: true });
});

describe('serve listens on this machine only', () => {
  it('binds 127.0.0.1: another loopback address of this machine (127.0.0.2) is refused', async () => {
    expect(server.host).toBe('127.0.0.1');
    expect(server.url).toBe(`http://127.0.0.1:${server.port}/`);
    expect((await get('/')).status).toBe(200);
    // Linux routes all of 127.0.0.0/8 to this machine: a server on every interface would answer here.
    await expect(get('/', '127.0.0.2')).rejects.toMatchObject({ code: 'ECONNREFUSED' });
  });

  it('--listen-address takes only an IP address', async () => {
    expect(await run(['serve', '--listen-address', 'everyone'], root)).toEqual({ code: 2, out: '', err: 'cellbasis: serve: --listen-address must be an IP address of this machine (127.0.0.1, 0.0.0.0, ::), got "everyone"\n' });
    expect((await run(['serve', '--port', '0x50'], root)).code).toBe(2);
  });
});

describe('malformed request paths', () => {
  const CASES: [string, number][] = [
    ['/%', 400],
    ['/%E0%A4%A', 400],
    ['/%ff', 400],
    ['/projects%2F..%2F..%2Fetc%2Fpasswd', 400],
    ['/..%2fbasis.yaml', 400],
    ['/%5c..%5c..%5cetc%5cpasswd', 400],
    ['/a\\..\\b', 400],
    ['/index.html%00.pdf', 400],
    ['//etc/passwd', 400],
    ['/projects/../../etc/passwd', 404],
    ['/projects/%2e%2e/%2e%2e/etc/passwd', 404],
    ['/./index.html', 404],
    [`/projects/${ID}/basis.yaml`, 404],
  ];
  it.each(CASES)('%s: %i, and the server goes on', async (path, status) => {
    expect(requestPathProblem(path) ?? 404).toBe(status);
    const r = await get(path);
    expect(r.status).toBe(status);
    expect(r.body).not.toContain('root:');
    expect((await get('/')).status).toBe(200);
  });
});

describe('every way of saving is rebuilt', () => {
  it('a save by rename first, then rename again, truncate and write, delete and write again', async () => {
    const path = basisFile(root, ID);
    expect(await until(`/projects/${ID}/`, (h) => h.includes(TITLE))).toContain(TITLE);
    const saves: [string, (text: string) => void][] = [
      ['rename over it', (t) => (writeFileSync(`${path}.new`, t), renameSync(`${path}.new`, path))],
      ['rename over it again', (t) => (writeFileSync(`${path}.new`, t), renameSync(`${path}.new`, path))],
      ['truncate and write in place', (t) => {
        const fd = openSync(path, 'r+');
        ftruncateSync(fd, 0);
        writeSync(fd, t, 0);
        closeSync(fd);
      }],
      ['delete and write again', (t) => (rmSync(path), writeFileSync(path, t))],
      ['write in place', (t) => writeFileSync(path, t)],
    ];
    let n = 20;
    for (const [how, save] of saves) {
      n++;
      save(titled(n));
      const html = await until(`/projects/${ID}/`, (h) => h.includes(`${n} kW PEM`));
      expect(html, how).toContain(`${n} kW PEM backup power unit`);
    }
    writeFileSync(path, good);
    expect(await until(`/projects/${ID}/`, (h) => h.includes(TITLE))).toContain(TITLE);
  }, 120_000);

  it('a new project folder is built and listed', async () => {
    mkdirSync(join(root, 'projects', 'new-unit'));
    writeFileSync(join(root, 'projects', 'new-unit', 'basis.yaml'), titled(31));
    expect(await until('/projects/new-unit/', (h) => h.includes('31 kW PEM'))).toContain('31 kW PEM backup power unit');
    expect(await until('/', (h) => h.includes('31 kW PEM'))).toContain('31 kW PEM backup power unit');
  }, 60_000);
});

describe('what happens to projects never stops it', () => {
  it('a save that makes the calculation fail keeps the server and says why on the index page', async () => {
    writeFileSync(basisFile(root, ID), good.replace('composition: { H2: 0.9999, N2: 0.0001 }', 'composition: { H2: 0.5, CH4: 0.5 }'));
    const index = await until('/', (h) => h.includes('cannot reach the requested utilization'));
    expect(index).toMatch(/projects\/hob-tor-pem-backup\/basis\.yaml:\d+:\d+: operating-point\.fuel-utilization: the fuel cannot reach the requested utilization/);
    writeFileSync(basisFile(root, ID), good);
    expect(await until('/', (h) => h.includes(TITLE) && !h.includes('cannot reach'))).toContain(TITLE);
  }, 60_000);

  it('a project renamed to a name that is no id is named on the index, and its old pages are gone', async () => {
    renameSync(join(root, 'projects', 'new-unit'), join(root, 'projects', 'New_Unit'));
    const index = await until('/', (h) => h.includes('projects/New_Unit is no project'));
    expect(index).toContain('projects/New_Unit is no project');
    expect(index).not.toContain('31 kW PEM');
    expect((await get('/projects/new-unit/')).status).toBe(404);
    rmSync(join(root, 'projects', 'New_Unit'), { recursive: true });
    expect(await until('/', (h) => !h.includes('New_Unit'))).not.toContain('New_Unit');
  }, 60_000);

  it('the issued revision\'s PDF is served beside its page', async () => {
    const pdf = await get(`/projects/${ID}/rev-A/document.pdf`);
    expect(pdf.status).toBe(200);
    expect(pdf.body.startsWith('%PDF-')).toBe(true);
    expect((await get(`/projects/${ID}/rev-A/`)).body).toContain('href="document.pdf"');
  });

  it('a project deleted loses its pages and the server goes on', async () => {
    const copy = join(root, 'kept-basis.yaml');
    writeFileSync(copy, good);
    rmSync(join(root, 'projects', ID), { recursive: true });
    expect(await until('/', (h) => !h.includes(TITLE))).not.toContain(TITLE);
    expect((await get(`/projects/${ID}/`)).status).toBe(404);
    mkdirSync(join(root, 'projects', ID));
    writeFileSync(basisFile(root, ID), good);
    expect(await until(`/projects/${ID}/`, (h) => h.includes(TITLE))).toContain(TITLE);
  }, 60_000);

  it('a basis deleted from its folder makes the folder no project on the index, and written again a project again', async () => {
    // A change inside a project's folder looks at that entry of projects/ again, not at them all:
    // that entry must still change from a project to no project and back.
    rmSync(basisFile(root, ID));
    const index = await until('/', (h) => h.includes(`projects/${ID} is no project`));
    expect(index).toContain(`projects/${ID} is no project: it holds no basis.yaml`);
    expect(index).not.toContain(TITLE);
    expect((await get(`/projects/${ID}/`)).status).toBe(404);
    writeFileSync(basisFile(root, ID), good);
    expect(await until('/', (h) => h.includes(TITLE) && !h.includes('is no project'))).toContain(TITLE);
    expect(await until(`/projects/${ID}/`, (h) => h.includes(TITLE))).toContain(TITLE);
  }, 60_000);
});

describe('a taken port', () => {
  let taken: Server;
  afterAll(() => new Promise<void>((done) => (taken ? taken.close(() => done()) : done())));

  it('is replaced by the next free one, and the port really used is returned', async () => {
    const port = await freePort();
    taken = await new Promise<Server>((resolve) => {
      const s = createServer().listen(port, '127.0.0.1', () => resolve(s));
    });
    const second = await serveSite({ root, port, out: join(root, 'site-2') });
    try {
      expect(second.port).not.toBe(port);
      expect(second.port).toBeGreaterThan(port);
      expect(second.url).toBe(`http://127.0.0.1:${second.port}/`);
      expect((await get('/', '127.0.0.1', second.port)).status).toBe(200);
    } finally {
      await second.stop();
    }
  }, 120_000);
});
