// Matches the files a deployment table names to the files the user picked in the app (paths relative to the picked
// folder, or bare names): the path joined to the table's folder, else as written, else the longest shared ending, else the name.
import { WhenceError } from '../errors';
import { printableText } from '../text';
import type { DeploymentTable } from './deploymentTable';
import { pathBaseName } from './openDeploymentTable';

/** A path with `/` separators and no `.` components, `..` taken back where it can be; `undefined` for one that climbs above the top. */
export function normalisePickedPath(path: string): string | undefined {
  const parts: string[] = [];
  for (const part of path.replace(/\\/g, '/').split('/')) {
    if (part === '' || part === '.') continue;
    if (part === '..') {
      if (parts.length === 0) return undefined;
      parts.pop();
    } else {
      parts.push(part);
    }
  }
  return parts.join('/');
}

/** True when a table path is absolute (`/data/a.wav`, `C:\data\a.wav`, `\\server\share\a.wav`): it can only match by its end. */
function isAbsolutePath(path: string): boolean {
  return /^([a-zA-Z]:)?[\\/]/.test(path);
}

/** Of the picked files `candidates` (those of the same name), the one sharing the most trailing path components with `file`, two at least. */
function longestCommonEnding(file: string, candidates: readonly number[], pickedParts: readonly string[][]): number | undefined {
  const parts = file.replace(/\\/g, '/').split('/').filter((part) => part !== '' && part !== '.');
  let best = 1;
  let bestIndex: number | undefined;
  candidates.forEach((index) => {
    const candidate = pickedParts[index]!;
    let common = 0;
    while (common < parts.length && common < candidate.length && parts[parts.length - 1 - common] === candidate[candidate.length - 1 - common]) common++;
    if (common > best) { best = common; bestIndex = index; } else if (common === best) bestIndex = undefined;
  });
  return bestIndex;
}

/**
 * For each file the table names (as written), the index of the picked file it is. `tablePath` is the table's own path in
 * the picked folder (`site/deployment.csv`) or its bare name. Throws a WhenceError naming the table line when a file
 * matches no picked file or, by name only, two of them.
 */
export function matchPickedFiles(table: DeploymentTable, tablePath: string, pickedPaths: readonly string[]): Map<string, number> {
  const picked = pickedPaths.map((path) => normalisePickedPath(path) ?? path);
  const tableFolder = normalisePickedPath(tablePath.replace(/\\/g, '/').split('/').slice(0, -1).join('/')) ?? '';
  const byPath = new Map<string, number[]>();
  const byName = new Map<string, number[]>();
  const add = (map: Map<string, number[]>, key: string, index: number) => { const list = map.get(key); if (list === undefined) map.set(key, [index]); else list.push(index); };
  picked.forEach((path, index) => { add(byPath, path, index); add(byName, pathBaseName(path), index); });
  const pickedParts = picked.map((path) => path.split('/'));
  const unique = (list: readonly number[] | undefined) => (list !== undefined && list.length === 1 ? list[0] : undefined);
  const where = (file: string) => {
    const line = table.rows.find((row) => row.file === file)!.lineNumber;
    return `${printableText(table.fileName, 120)} line ${line}: ${printableText(file, 160)}`;
  };
  const matches = new Map<string, number>();
  for (const file of new Set(table.rows.map((row) => row.file))) {
    const absolute = isAbsolutePath(file);
    const written = absolute ? undefined : normalisePickedPath(file);
    const joined = absolute ? undefined : normalisePickedPath(tableFolder === '' ? file : `${tableFolder}/${file}`);
    const found = (joined !== undefined ? unique(byPath.get(joined)) : undefined)
      ?? (written !== undefined ? unique(byPath.get(written)) : undefined)
      ?? longestCommonEnding(file, byName.get(pathBaseName(file)) ?? [], pickedParts);
    if (found !== undefined) { matches.set(file, found); continue; }
    const name = pathBaseName(file);
    const named = byName.get(name) ?? [];
    if (named.length === 1) { matches.set(file, named[0]!); continue; }
    if (named.length > 1) {
      throw new WhenceError('deployment-file-ambiguous', `${where(file)} matches ${named.length} picked files (${printableText(named.slice(0, 3).map((i) => pickedPaths[i]).join(', '), 240)}${named.length > 3 ? ', ...' : ''}). Pick the folder that holds the table, so the table's paths tell them apart, or pick only the files of this deployment.`);
    }
    // Memory cards are often read on systems that ignore case: a name differing only in case still matches when it is the only one.
    const folded = picked.flatMap((path, index) => (pathBaseName(path).toLowerCase() === name.toLowerCase() ? [index] : []));
    if (folded.length === 1) { matches.set(file, folded[0]!); continue; }
    throw new WhenceError('deployment-file-not-picked', `${where(file)} is not among the ${pickedPaths.length} picked file${pickedPaths.length === 1 ? '' : 's'}. Pick the folder that holds the table and its recordings, or pick this file together with the others.`);
  }
  return matches;
}
