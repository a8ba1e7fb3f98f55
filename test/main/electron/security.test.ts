import { describe, expect, it } from 'vitest';
import { CONTENT_SECURITY_POLICY, isAllowedPageUrl, secureWebPreferences } from '../../../main/electron/security';

// The expectations follow Electron's security checklist (electronjs.org "Security" tutorial), common practice.
describe('desktop window security', () => {
  it('secureWebPreferences() turns on isolation and sandbox and turns off Node integration', () => {
    const preferences = secureWebPreferences('/app/preload.cjs');
    expect(preferences).toMatchObject({ contextIsolation: true, sandbox: true, nodeIntegration: false, webSecurity: true, webviewTag: false, allowRunningInsecureContent: false });
    expect(preferences.preload).toBe('/app/preload.cjs');
  });

  it('the Content-Security-Policy allows only the app’s own scripts and no plugins', () => {
    expect(CONTENT_SECURITY_POLICY).toContain("default-src 'self'");
    expect(CONTENT_SECURITY_POLICY).toContain("script-src 'self';");
    expect(CONTENT_SECURITY_POLICY).toContain("object-src 'none'");
    expect(CONTENT_SECURITY_POLICY).not.toContain('unsafe-eval');
  });

  it('isAllowedPageUrl() admits only the bundled page', () => {
    const index = 'file:///opt/whence/dist-web/index.html';
    expect(isAllowedPageUrl('file:///opt/whence/dist-web/index.html', index)).toBe(true);
    expect(isAllowedPageUrl('https://example.org/', index)).toBe(false);
    expect(isAllowedPageUrl('file:///etc/passwd', index)).toBe(false);
    expect(isAllowedPageUrl('not a url', index)).toBe(false);
  });
});
