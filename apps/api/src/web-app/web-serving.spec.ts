import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { brotliCompressSync } from 'node:zlib';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';

describe('serving the built web app from the API process', () => {
  let ctx: TestContext;
  const bundle = `console.log(${JSON.stringify('rhotrace '.repeat(20_000))});`;
  const brotli = brotliCompressSync(Buffer.from(bundle));
  beforeAll(async () => {
    const dist = mkdtempSync(join(tmpdir(), 'rhotrace-dist-'));
    writeFileSync(
      join(dist, 'index.html'),
      '<!doctype html><title>Rhotrace</title><rt-root></rt-root>',
    );
    writeFileSync(join(dist, 'main-TEST.js'), bundle);
    writeFileSync(join(dist, 'plot-TEST.js'), bundle);
    writeFileSync(join(dist, 'plot-TEST.js.br'), brotli);
    writeFileSync(join(dist, 'chunk-5OBG24MO.js'), bundle);
    writeFileSync(join(dist, 'chunk-5OBG24MO.js.br'), brotli);
    writeFileSync(join(dist, 'favicon.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>');
    ctx = await createTestContext({ webDist: dist });
  });
  afterAll(async () => {
    await ctx.close();
  });

  it('answers deep links with index.html under the strict content security policy', async () => {
    const res = await request(ctx.app).get('/sweeps/12?tab=fits');
    expect(res.status).toBe(200);
    expect(res.text).toContain('<rt-root>');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['content-security-policy']).toContain("script-src 'self'");
  });

  it('sends the JavaScript bundle gzip-compressed to browsers that accept it', async () => {
    const res = await request(ctx.app).get('/main-TEST.js').set('Accept-Encoding', 'gzip');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.text).toBe(bundle);
  });

  it('sends a precompressed .br copy as it is, with the type of the original file', async () => {
    const res = await request(ctx.app)
      .get('/plot-TEST.js')
      .set('Accept-Encoding', 'br, gzip')
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(Number(res.headers['content-length'])).toBe(brotli.length);
  });

  it('keeps files named after their content a year, and others (and index.html) briefly', async () => {
    for (const encoding of ['br', 'identity']) {
      const hashed = await request(ctx.app)
        .get('/chunk-5OBG24MO.js')
        .set('Accept-Encoding', encoding);
      expect(hashed.status).toBe(200);
      expect(hashed.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    }
    const plain = await request(ctx.app).get('/favicon.svg');
    expect(plain.headers['cache-control']).toBe('public, max-age=3600');
    const page = await request(ctx.app).get('/sweeps/12');
    expect(page.headers['cache-control']).not.toMatch(/immutable|max-age=[1-9]/);
  });

  it('never compresses sign-in answers, which carry a token', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/login')
      .set('Accept-Encoding', 'gzip')
      .send({ email: ctx.users.engineer.email, password: 'wrong password here' });
    expect(res.status).toBe(401);
    expect(res.headers['content-encoding']).toBeUndefined();
  });

  it('keeps unknown API paths as JSON 404s rather than the web app', async () => {
    const res = await request(ctx.app).get('/api/not-a-route');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});

describe('serving the web app from a checkout inside a folder whose name starts with a dot', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    // e.g. a checkout under ~/.local/src: `send` refuses dotted folders in an absolute path
    const dist = join(mkdtempSync(join(tmpdir(), 'rhotrace-')), '.hidden', 'dist');
    mkdirSync(dist, { recursive: true });
    writeFileSync(join(dist, 'index.html'), '<!doctype html><title>Rhotrace</title><rt-root>');
    writeFileSync(join(dist, 'main-TEST.js'), 'console.log("rhotrace");');
    ctx = await createTestContext({ webDist: dist });
  });
  afterAll(async () => {
    await ctx.close();
  });

  it('answers a deep link with index.html', async () => {
    const res = await request(ctx.app).get('/lots/3/wafers?tab=sweeps');
    expect(res.status).toBe(200);
    expect(res.text).toContain('<rt-root>');
  });

  it('serves the bundle files beside it', async () => {
    const res = await request(ctx.app).get('/main-TEST.js');
    expect(res.status).toBe(200);
    expect(res.text).toContain('rhotrace');
  });

  it('still refuses dotted names inside the build folder itself', async () => {
    writeFileSync(join(ctx.config.webDist, '.secret'), 'not for the web');
    const res = await request(ctx.app).get('/.secret');
    expect(res.text).not.toContain('not for the web');
  });
});
