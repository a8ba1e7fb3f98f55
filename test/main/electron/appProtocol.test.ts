import { mkdirSync, mkdtempSync, realpathSync, symlinkSync, writeFileSync } from 'node:fs';
import { readFile, realpath, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { APP_INDEX_URL, APP_SCHEME_PRIVILEGES, contentTypeOf, createAppRequestHandler } from '../../../main/electron/appProtocol';
import { CONTENT_SECURITY_POLICY, isAllowedPageUrl } from '../../../main/electron/security';

// Expected behaviour: the Electron security checklist (custom protocol instead of file://; CSP on every page response) and
// HTTP status meanings (RFC 9110: 403, 404, 405), common practice.
function handlerWithSite() {
  const top = realpathSync(mkdtempSync(join(tmpdir(), 'whence-app-protocol-')));
  const site = join(top, 'dist-web');
  mkdirSync(join(site, 'assets'), { recursive: true });
  writeFileSync(join(site, 'index.html'), '<!doctype html><title>Whence</title>');
  writeFileSync(join(site, 'assets', 'index-abc.js'), 'console.log(1)');
  writeFileSync(join(top, 'secret.txt'), 'secret');
  symlinkSync(join(top, 'secret.txt'), join(site, 'leak.txt'));
  const logged: string[] = [];
  const handle = createAppRequestHandler({ folder: site, realpath, stat, readFile, log: (message) => logged.push(message) });
  return { handle, logged };
}

describe('createAppRequestHandler()', () => {
  it('answers GET of the page with its bytes, its type and the Content-Security-Policy', async () => {
    const { handle } = handlerWithSite();
    const response = await handle({ url: APP_INDEX_URL, method: 'GET' });
    expect(response.status).toBe(200);
    expect(await response.text()).toBe('<!doctype html><title>Whence</title>');
    expect(response.headers.get('content-type')).toBe('text/html; charset=utf-8');
    expect(response.headers.get('content-security-policy')).toBe(CONTENT_SECURITY_POLICY);
    expect(response.headers.get('x-content-type-options')).toBe('nosniff');
    const script = await handle({ url: 'whence-app://app/assets/index-abc.js?v=2', method: 'GET' });
    expect(script.headers.get('content-type')).toBe('text/javascript; charset=utf-8');
    expect(await script.text()).toBe('console.log(1)');
  });

  it('answers HEAD without a body and refuses other methods with 405', async () => {
    const { handle } = handlerWithSite();
    const head = await handle({ url: APP_INDEX_URL, method: 'HEAD' });
    expect(head.status).toBe(200);
    expect(await head.text()).toBe('');
    expect((await handle({ url: APP_INDEX_URL, method: 'POST' })).status).toBe(405);
  });

  it('refuses a link out of the folder with 403 and a smuggled traversal with 403, logging the address, never the contents', async () => {
    const { handle, logged } = handlerWithSite();
    const leak = await handle({ url: 'whence-app://app/leak.txt', method: 'GET' });
    expect(leak.status).toBe(403);
    expect(await leak.text()).toBe('Forbidden');
    const smuggled = await handle({ url: 'whence-app://app/assets%2F..%2F..%2Fsecret.txt', method: 'GET' });
    expect(smuggled.status).toBe(403);
    expect(await smuggled.text()).not.toContain('secret');
    expect(logged).toEqual([expect.stringContaining('leak.txt (a link out of the page folder)'), expect.stringContaining('(a dot segment in the path)')]);
  });

  it('gives 404 for a missing file, traversal that lands inside on nothing, and another host', async () => {
    const { handle } = handlerWithSite();
    for (const url of ['whence-app://app/missing.js', 'whence-app://app/../secret.txt', 'whence-app://app/%2e%2e/secret.txt', 'whence-app://other/index.html']) {
      const response = await handle({ url, method: 'GET' });
      expect(response.status, url).toBe(404);
      expect(await response.text()).toBe('Not found');
    }
  });
});

describe('the whence-app scheme', () => {
  it('is registered as a standard, secure scheme with fetch, so the page has an origin of its own', () => {
    // Electron protocol.registerSchemesAsPrivileged: standard for relative URLs and 'self', secure like https (Electron docs)
    expect(APP_SCHEME_PRIVILEGES).toEqual({ scheme: 'whence-app', privileges: { standard: true, secure: true, supportFetchAPI: true, codeCache: true } });
    expect(APP_INDEX_URL).toBe('whence-app://app/index.html');
    expect(isAllowedPageUrl(APP_INDEX_URL, APP_INDEX_URL)).toBe(true);
  });

  it('contentTypeOf() names the types of the built page and falls back to bytes', () => {
    expect(contentTypeOf('/a/b/worker-1.js')).toBe('text/javascript; charset=utf-8');
    expect(contentTypeOf('/a/index.CSS')).toBe('text/css; charset=utf-8');
    expect(contentTypeOf('/a/icon.svg')).toBe('image/svg+xml');
    expect(contentTypeOf('/a/blob.bin')).toBe('application/octet-stream');
  });
});
