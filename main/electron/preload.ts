// Preload: exposes one small typed object to the page (core/contract HostApi), never a generic message channel.
import { contextBridge } from 'electron';
import { HOST_GLOBAL_NAME, type HostApi } from '../../core/contract';
import { WHENCE_VERSION } from '../../core/version';

const host: HostApi = { kind: 'electron', appVersion: WHENCE_VERSION };
contextBridge.exposeInMainWorld(HOST_GLOBAL_NAME, host);
