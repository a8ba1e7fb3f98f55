// Preload (sandboxed): exposes the one typed host object of core/contract to the page through the context bridge.
// Everything it does is in hostBridge.ts; this file only hands it Electron's ipcRenderer and webUtils.
import { contextBridge, ipcRenderer, webUtils } from 'electron';
import { HOST_GLOBAL_NAME } from '../../core/contract';
import { WHENCE_VERSION } from '../../core/version';
import { createHostApi } from './hostBridge';

contextBridge.exposeInMainWorld(HOST_GLOBAL_NAME, createHostApi(ipcRenderer, webUtils, { appVersion: WHENCE_VERSION, platform: process.platform }));
