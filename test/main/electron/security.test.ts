import { describe, expect, it } from 'vitest';
import {
  CONTENT_SECURITY_POLICY,
  denyPermissionCheck,
  denyPermissionRequest,
  isAllowedPageUrl,
  isAllowedRequestUrl,
  navigationGuard,
  secureWebPreferences,
  withContentSecurityPolicy,
} from '../../../main/electron/security';

// The expectations follow Electron's security checklist (electronjs.org "Security" tutorial), common practice.
describe('desktop window security', () => {
  it('secureWebPreferences() turns on isolation and sandbox and turns off Node integration', () => {
    const preferences = secureWebPreferences('/app/preload.cjs');
    expect(preferences).toMatchObject({ contextIsolation: true, sandbox: true, nodeIntegration: false, webSecurity: true, webviewTag: false, allowRunningInsecureContent: false });
    expect(preferences.preload).toBe('/app/preload.cjs');
  });

  it('the Content-Security-Policy allows only the app’s own scripts and no plugins', () => {
    expect(CONTENT_SECURITY_POLICY).toContain("default-src 'self'");
    // 'wasm-unsafe-eval' lets the worker compile the app's own WebAssembly FFT, not evaluate strings (W3C CSP Level 3; common practice).
    expect(CONTENT_SECURITY_POLICY).toContain("script-src 'self' 'wasm-unsafe-eval';");
    expect(CONTENT_SECURITY_POLICY).toContain("object-src 'none'");
    expect(CONTENT_SECURITY_POLICY).not.toContain("'unsafe-eval'");
  });

  it('isAllowedPageUrl() admits only the bundled page, served as whence-app://app/ and never as file:', () => {
    const index = 'whence-app://app/index.html';
    expect(isAllowedPageUrl('whence-app://app/index.html', index)).toBe(true);
    expect(isAllowedPageUrl('https://example.org/', index)).toBe(false);
    expect(isAllowedPageUrl('file:///etc/passwd', index)).toBe(false);
    expect(isAllowedPageUrl('file:///opt/whence/dist-web/index.html', index)).toBe(false);
    expect(isAllowedPageUrl('file://app/index.html', index)).toBe(false);
    expect(isAllowedPageUrl('not a url', index)).toBe(false);
  });
});

describe('desktop window security, further checklist items', () => {
  const folderUrl = 'whence-app://app/';
  const pageUrl = 'whence-app://app/index.html';

  it('secureWebPreferences() also refuses sub-frame Node, webviews, experimental features and drop navigation', () => {
    expect(secureWebPreferences('/p.cjs')).toMatchObject({ nodeIntegrationInWorker: false, nodeIntegrationInSubFrames: false, experimentalFeatures: false, navigateOnDragDrop: false });
  });

  it('the Content-Security-Policy refuses frames and inline or evaluated scripts', () => {
    expect(CONTENT_SECURITY_POLICY).toContain("frame-src 'none'");
    expect(CONTENT_SECURITY_POLICY).toContain("frame-ancestors 'none'");
    expect(CONTENT_SECURITY_POLICY).not.toMatch(/script-src[^;]*unsafe-inline/);
    expect(CONTENT_SECURITY_POLICY).not.toMatch(/https?:|\*/);
  });

  it('isAllowedRequestUrl() lets the page load its own files and blobs but no file: URL and no remote content', () => {
    expect(isAllowedRequestUrl('whence-app://app/assets/index-abc.js', folderUrl)).toBe(true);
    expect(isAllowedRequestUrl('whence-app://app/index.html?x=1', folderUrl)).toBe(true);
    expect(isAllowedRequestUrl('blob:whence-app://app/0f6c-4a', folderUrl)).toBe(true);
    expect(isAllowedRequestUrl('file:///opt/whence/dist-web/assets/index-abc.js', folderUrl)).toBe(false);
    expect(isAllowedRequestUrl('whence-app://other/assets/index-abc.js', folderUrl)).toBe(false);
    expect(isAllowedRequestUrl('whence-app://app/a%2F..%2F..%2Fsecret.txt', folderUrl)).toBe(false);
    expect(isAllowedRequestUrl('data:image/png;base64,AAAA', folderUrl)).toBe(true);
    expect(isAllowedRequestUrl('https://example.org/tracker.js', folderUrl)).toBe(false);
    expect(isAllowedRequestUrl('http://127.0.0.1:5173/', folderUrl)).toBe(false);
    expect(isAllowedRequestUrl('wss://example.org/', folderUrl)).toBe(false);
    expect(isAllowedRequestUrl('file:///home/user/.ssh/id_rsa', folderUrl)).toBe(false);
    expect(isAllowedRequestUrl('file:///opt/whence/dist-web/../secret.txt', folderUrl)).toBe(false);
    expect(isAllowedRequestUrl('::not a url', folderUrl)).toBe(false);
  });

  it('isAllowedPageUrl() ignores a query or fragment but not another host or an encoded other path', () => {
    expect(isAllowedPageUrl(`${pageUrl}#/map`, pageUrl)).toBe(true);
    expect(isAllowedPageUrl('whence-app://evil-host/index.html', pageUrl)).toBe(false);
    expect(isAllowedPageUrl('whence-app://app/index%2Ehtml', pageUrl)).toBe(true);
    expect(isAllowedPageUrl('whence-app://app/other.html', pageUrl)).toBe(false);
  });

  it('withContentSecurityPolicy() replaces any policy a response carried', () => {
    const headers = withContentSecurityPolicy({ 'content-security-policy': ["default-src *"], 'Content-Type': 'text/html' });
    expect(headers).toEqual({ 'Content-Type': ['text/html'], 'Content-Security-Policy': [CONTENT_SECURITY_POLICY] });
    expect(withContentSecurityPolicy(undefined)).toEqual({ 'Content-Security-Policy': [CONTENT_SECURITY_POLICY] });
  });

  it('permission requests and checks are refused', () => {
    const answers: boolean[] = [];
    for (const permission of ['media', 'geolocation', 'notifications', 'openExternal', 'clipboard-read']) denyPermissionRequest({}, permission, (granted) => answers.push(granted));
    expect(answers).toEqual([false, false, false, false, false]);
    expect(denyPermissionCheck()).toBe(false);
  });

  it('navigationGuard() refuses navigation and redirects away from the page, new windows and webviews', () => {
    const guard = navigationGuard(pageUrl);
    const attempt = (listener: (event: { preventDefault(): void }, url: string) => void, url: string): boolean => {
      let prevented = false;
      listener({ preventDefault: () => { prevented = true; } }, url);
      return prevented;
    };
    expect(attempt(guard.onWillNavigate, 'https://example.org/')).toBe(true);
    expect(attempt(guard.onWillNavigate, 'file:///tmp/dropped.html')).toBe(true);
    expect(attempt(guard.onWillNavigate, 'whence-app://app/other.html')).toBe(true);
    expect(attempt(guard.onWillNavigate, pageUrl)).toBe(false);
    expect(attempt(guard.onWillRedirect, 'https://example.org/')).toBe(true);
    expect(attempt((event) => guard.onWillAttachWebview(event), 'about:blank')).toBe(true);
    expect(guard.windowOpenHandler()).toEqual({ action: 'deny' });
  });
});
