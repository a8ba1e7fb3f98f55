// Types shared by main/ and renderer/: what the desktop shell's preload exposes to the page (types and constants only).

/** The object the preload script places on `window.whenceHost`; absent when the page runs in a plain browser. */
export interface HostApi {
  readonly kind: 'electron';
  readonly appVersion: string;
}

export const HOST_GLOBAL_NAME = 'whenceHost';
