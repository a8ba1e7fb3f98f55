import { describe, expect, it } from 'vitest';
import { chooseDeploymentTable, csvKindOfHead, deploymentSizeBytes, isAudioFileName, isCsvFileName, pickedPath } from '../../../renderer/deployment/pickedFiles';
import { FIXTURE_TABLE } from './layoutFixture';

// Expected values: this project's rules for picked files (paths relative to the picked folder, the deployment table told
// by its head recorder,file,file_channel,microphone of issue 9); the file names are invented.
describe('pickedPath()', () => {
  it('drops the picked folder\'s own name from a file in a folder pick, and keeps the bare name of a single file', () => {
    expect(pickedPath('a.wav', 'field-2026/a.wav')).toBe('a.wav');
    expect(pickedPath('a.wav', 'field-2026/north/a.wav')).toBe('north/a.wav');
    expect(pickedPath('a.wav', '')).toBe('a.wav');
  });
});

describe('isAudioFileName()', () => {
  it('takes WAV, RF64 and BW64 names in any case, nothing else', () => {
    expect(['A.WAV', 'b.wav', 'c.rf64', 'd.BW64'].every(isAudioFileName)).toBe(true);
    expect(['a.csv', 'a.wav.txt', 'wav'].some(isAudioFileName)).toBe(false);
  });
});

describe('isCsvFileName()', () => {
  it('takes .csv names in any case', () => {
    expect(isCsvFileName('Deployment.CSV')).toBe(true);
    expect(isCsvFileName('deployment.csv.bak')).toBe(false);
  });
});

describe('csvKindOfHead()', () => {
  it('tells a deployment table, a calibration table, a shared-sound table and an array table by their header rows', () => {
    expect(csvKindOfHead(FIXTURE_TABLE)).toBe('deployment');
    expect(csvKindOfHead('\ufeff# made by hand\nrecorder;file;file_channel;microphone;start_time\nA;a.wav;1;N\n')).toBe('deployment');
    expect(csvKindOfHead('label,time,x_m,y_m,z_m\nclap,2025-05-17T05:09:52,1,2,3\n')).toBe('calibration');
    expect(csvKindOfHead('channel,label,x_m,y_m,z_m\n1,N,0,0,0\n')).toBe('array');
    expect(csvKindOfHead('channel,label,lat,lon,alt_m\n1,N,51,14,90\n')).toBe('array');
    expect(csvKindOfHead('label,time\nclap-1,2025-05-17T05:11:14.0\n')).toBe('shared-sounds'); // core/deployment parseSharedSoundsCsv: time[,label]
    expect(csvKindOfHead('time\n4\n10\n')).toBe('shared-sounds');
    expect(csvKindOfHead('event,time_s,x_m,y_m\n1,2.5,3,4\n')).toBe('other'); // a survey log's columns are not a sound table's
    expect(csvKindOfHead('mic_a,mic_b,delay_s\nA,B,0.001\n')).toBe('other');
    expect(csvKindOfHead('')).toBe('other');
  });
});

describe('chooseDeploymentTable()', () => {
  it('takes the only deployment table among other CSV files without asking', () => {
    expect(chooseDeploymentTable([{ path: 'array.csv', kind: 'array' }, { path: 'deployment.csv', kind: 'deployment' }, { path: 'calibration.csv', kind: 'calibration' }], 13, 'The folder x')).toEqual({ kind: 'one', path: 'deployment.csv' });
  });

  it('asks among several deployment tables', () => {
    expect(chooseDeploymentTable([{ path: 'may.csv', kind: 'deployment' }, { path: 'june/deployment.csv', kind: 'deployment' }, { path: 'array.csv', kind: 'array' }], 4, 'The folder x')).toEqual({ kind: 'ask', paths: ['may.csv', 'june/deployment.csv'] });
  });

  it('says what is missing and what to do when there is no deployment table', () => {
    const none = chooseDeploymentTable([], 3, 'The folder field');
    expect(none.kind).toBe('none');
    expect(none.kind === 'none' && none.message).toMatch(/^The folder field holds no CSV file.*recorder,file,file_channel,microphone.*3 WAV files were found\.$/);
    const wrong = chooseDeploymentTable([{ path: 'array.csv', kind: 'array' }], 3, 'The files you picked');
    expect(wrong.kind === 'none' && wrong.message).toMatch(/none of its CSV files \(array\.csv\) starts with recorder,file,file_channel,microphone\. Add that header row/);
  });
});

describe('deploymentSizeBytes()', () => {
  it('sums the sizes of the files the table names, not of other files picked with them', () => {
    const picked = [{ path: 'a1.wav', sizeBytes: 10 }, { path: 'a2.wav', sizeBytes: 20 }, { path: 'b1.wav', sizeBytes: 300 }, { path: 'b2.wav', sizeBytes: 4000 }, { path: 'old/other.wav', sizeBytes: 50_000 }];
    expect(deploymentSizeBytes({ path: 'deployment.csv', text: FIXTURE_TABLE }, picked)).toBe(4330);
  });

  it('gives undefined when a file of the table was not picked (opening then says which)', () => {
    expect(deploymentSizeBytes({ path: 'deployment.csv', text: FIXTURE_TABLE }, [{ path: 'a1.wav', sizeBytes: 10 }])).toBeUndefined();
    expect(deploymentSizeBytes({ path: 'deployment.csv', text: 'not,a,table\n' }, [])).toBeUndefined();
  });
});
