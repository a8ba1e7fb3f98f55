import { mkdirSync, mkdtempSync, realpathSync, symlinkSync, writeFileSync } from 'node:fs';
import { realpath, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { appRequestPath, isInsideFolder, resolveAppFile } from '../../../main/electron/appFilePolicy';

// Expected behaviour: the Electron security checklist ("Avoid usage of the file:// protocol and prefer usage of custom
// protocols", with a path check) and URL parsing as in the WHATWG URL standard (dot segments, %2e); no outside values.
const origin = { scheme: 'whence-app', host: 'app' };
const fs = { realpath, stat };

/** A temporary tree: site/ (the page folder: index.html, assets/a.js, inner link), and a secret outside it. */
function tree() {
  const top = realpathSync(mkdtempSync(join(tmpdir(), 'whence-app-files-')));
  const site = join(top, 'site');
  mkdirSync(join(site, 'assets'), { recursive: true });
  mkdirSync(join(top, 'outside'));
  writeFileSync(join(site, 'index.html'), '<!doctype html>');
  writeFileSync(join(site, 'assets', 'a.js'), 'export {}');
  writeFileSync(join(top, 'secret.txt'), 'secret');
  writeFileSync(join(top, 'outside', 'b.js'), 'secret');
  symlinkSync(join(top, 'secret.txt'), join(site, 'leak.txt'));
  symlinkSync(join(top, 'outside'), join(site, 'linked'));
  symlinkSync(join(site, 'assets', 'a.js'), join(site, 'alias.js'));
  return { top, site };
}

describe('appRequestPath()', () => {
  const site = '/opt/whence/dist-web';

  it('maps the page and its assets into the folder; the bare origin is index.html; a query or fragment is ignored', () => {
    expect(appRequestPath('whence-app://app/index.html', origin, site)).toEqual({ allowed: true, filePath: '/opt/whence/dist-web/index.html' });
    expect(appRequestPath('whence-app://app/', origin, site)).toEqual({ allowed: true, filePath: '/opt/whence/dist-web/index.html' });
    expect(appRequestPath('whence-app://app/assets/index-abc.js?v=3#x', origin, site)).toEqual({ allowed: true, filePath: '/opt/whence/dist-web/assets/index-abc.js' });
    expect(appRequestPath('whence-app://app/assets/my%20file.js', origin, site)).toEqual({ allowed: true, filePath: '/opt/whence/dist-web/assets/my file.js' });
  });

  it('keeps .. and %2e%2e inside the folder (the URL parser removes them) and refuses them when smuggled through %2F', () => {
    for (const url of ['whence-app://app/../../etc/passwd', 'whence-app://app/%2e%2e/%2E%2E/etc/passwd', 'whence-app://app/assets/.%2e/.%2e/etc/passwd']) {
      expect(appRequestPath(url, origin, site)).toEqual({ allowed: true, filePath: '/opt/whence/dist-web/etc/passwd' });
    }
    for (const url of ['whence-app://app/assets%2F..%2F..%2Fsecret.txt', 'whence-app://app/%2e%2e%2Fsecret.txt', 'whence-app://app/a/%2E%2E%2f%2E%2E%2f%2E%2E%2fetc/passwd']) {
      expect(appRequestPath(url, origin, site)).toMatchObject({ allowed: false, status: 403 });
    }
  });

  it('treats absolute-looking paths as names inside the folder and refuses drive letters, backslashes and NUL', () => {
    expect(appRequestPath('whence-app://app//etc/passwd', origin, site)).toEqual({ allowed: true, filePath: '/opt/whence/dist-web/etc/passwd' });
    expect(appRequestPath('whence-app://app/%2Fetc%2Fpasswd', origin, site)).toEqual({ allowed: true, filePath: '/opt/whence/dist-web/etc/passwd' });
    expect(appRequestPath('whence-app://app/C:/Windows/win.ini', origin, site)).toMatchObject({ allowed: false, status: 403 });
    expect(appRequestPath('whence-app://app/..%5C..%5Csecret.txt', origin, site)).toMatchObject({ allowed: false, status: 400 });
    expect(appRequestPath('whence-app://app/index.html%00.js', origin, site)).toMatchObject({ allowed: false, status: 400 });
    expect(appRequestPath('whence-app://app/%E0%A4%A', origin, site)).toMatchObject({ allowed: false, status: 400 });
  });

  it('refuses another scheme, host, port or user', () => {
    for (const url of ['file:///opt/whence/dist-web/index.html', 'whence-app://other/index.html', 'whence-app://app:8080/index.html', 'whence-app://user@app/index.html', 'https://app/index.html', 'not a url']) {
      expect(appRequestPath(url, origin, site)).toMatchObject({ allowed: false });
    }
  });
});

describe('resolveAppFile()', () => {
  it('serves regular files of the folder by their real path, links inside the folder included', async () => {
    const { site } = tree();
    expect(await resolveAppFile('whence-app://app/', origin, site, fs)).toEqual({ allowed: true, filePath: join(site, 'index.html') });
    expect(await resolveAppFile('whence-app://app/assets/a.js?x=1', origin, site, fs)).toEqual({ allowed: true, filePath: join(site, 'assets', 'a.js') });
    expect(await resolveAppFile('whence-app://app/alias.js', origin, site, fs)).toEqual({ allowed: true, filePath: join(site, 'assets', 'a.js') });
  });

  it('refuses a link to a file or a folder outside, with 403', async () => {
    const { site } = tree();
    expect(await resolveAppFile('whence-app://app/leak.txt', origin, site, fs)).toMatchObject({ allowed: false, status: 403 });
    expect(await resolveAppFile('whence-app://app/linked/b.js', origin, site, fs)).toMatchObject({ allowed: false, status: 403 });
  });

  it('gives 404 for traversal that lands on nothing, a missing file, a folder, and a missing page folder', async () => {
    const { top, site } = tree();
    expect(await resolveAppFile('whence-app://app/../secret.txt', origin, site, fs)).toMatchObject({ allowed: false, status: 404 });
    expect(await resolveAppFile('whence-app://app/%2e%2e/secret.txt', origin, site, fs)).toMatchObject({ allowed: false, status: 404 });
    expect(await resolveAppFile('whence-app://app/missing.js', origin, site, fs)).toMatchObject({ allowed: false, status: 404 });
    expect(await resolveAppFile('whence-app://app/assets', origin, site, fs)).toMatchObject({ allowed: false, status: 404 });
    expect(await resolveAppFile('whence-app://app/index.html', origin, join(top, 'gone'), fs)).toMatchObject({ allowed: false, status: 404 });
  });

  it('serves a page folder reached through a link (the real folder is what counts)', async () => {
    const { top, site } = tree();
    symlinkSync(site, join(top, 'site-link'));
    expect(await resolveAppFile('whence-app://app/index.html', origin, join(top, 'site-link'), fs)).toEqual({ allowed: true, filePath: join(site, 'index.html') });
    expect(await resolveAppFile('whence-app://app/leak.txt', origin, join(top, 'site-link'), fs)).toMatchObject({ allowed: false, status: 403 });
  });
});

describe('isInsideFolder()', () => {
  it('is true only strictly inside, not for the folder itself, a sibling with a longer name, or its parent', () => {
    expect(isInsideFolder('/opt/site/a.js', '/opt/site')).toBe(true);
    expect(isInsideFolder('/opt/site/..a.js', '/opt/site')).toBe(true);
    expect(isInsideFolder('/opt/site', '/opt/site')).toBe(false);
    expect(isInsideFolder('/opt/site-other/a.js', '/opt/site')).toBe(false);
    expect(isInsideFolder('/opt/secret.txt', '/opt/site')).toBe(false);
  });
});
