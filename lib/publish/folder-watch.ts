/**
 * Watching a tree of folders for `cellbasis serve`: every folder of the tree is watched, never a
 * file. A watch on a file follows the file's inode, so once an editor saves by writing a new file
 * and renaming it over the old one (as `sed -i` and many editors' safe save do), or the file is
 * deleted and written again, the watch holds the old inode and later edits are never seen. A
 * watch on the folder sees every name in it change, however the change is made: written in
 * place, truncated and written, renamed over, deleted, created.
 *
 * Folders come and go (a new project, a project renamed or deleted, a new issued revision), so
 * when an event names a folder that is not watched yet, or a watched folder (or one holding
 * watched folders) that is gone, the tree is walked again: a new folder gets a watch, a vanished
 * one loses it. An event on a file (a saved basis.yaml) changes no folder and walks nothing, so a
 * save costs the same with 10 projects as with 2 000. The root itself may vanish and come back (projects/ deleted and made again); its parent is
 * watched for that. A watch that fails (the folder went between the walk and the watch) is
 * dropped and made again on the next walk; no watch error ends the process.
 *
 *   watchTree(root, onChange): { close() }   onChange(path) with the absolute path that changed
 */
import { readdirSync, statSync, watch, type FSWatcher } from 'node:fs';
import { basename, dirname, join, sep } from 'node:path';

export interface TreeWatch {
  close(): void;
}

/** Every folder under `root`, `root` first (none when root is no folder); links are not followed. */
function foldersUnder(root: string): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    let entries;
    try {
      entries = readdirSync(dir, { withFileTypes: true });
    } catch {
      return;
    }
    out.push(dir);
    for (const e of entries) if (e.isDirectory()) walk(join(dir, e.name));
  };
  walk(root);
  return out;
}

/** Watches every folder under `root` (and root's coming and going); `onChange` gets each changed path. */
export function watchTree(root: string, onChange: (path: string) => void): TreeWatch {
  const watchers = new Map<string, FSWatcher>();
  let closed = false;
  const drop = (dir: string) => {
    watchers.get(dir)?.close();
    watchers.delete(dir);
  };
  const sync = () => {
    if (closed) return;
    const now = new Set(foldersUnder(root));
    for (const dir of [...watchers.keys()]) if (dir !== PARENT && !now.has(dir)) drop(dir);
    for (const dir of now) if (!watchers.has(dir)) add(dir, (name) => (name ? join(dir, name) : dir));
  };
  // Whether the folders may have changed: `path` is a folder without a watch, or is gone while it
  // (or a folder under it) has one. An event without a name (path is the watched folder) may be anything.
  const foldersMoved = (path: string, named: boolean) => {
    if (!named) return true;
    if (statSync(path, { throwIfNoEntry: false })?.isDirectory()) return !watchers.has(path);
    if (watchers.has(path)) return true;
    const inside = path + sep;
    for (const dir of watchers.keys()) if (dir.startsWith(inside)) return true;
    return false;
  };
  const add = (dir: string, pathOf: (name: string | null) => string | null) => {
    let watcher: FSWatcher;
    try {
      watcher = watch(dir, { persistent: false }, (_event, name) => {
        const path = pathOf(name === null ? null : name.toString());
        if (path === null) return;
        if (foldersMoved(path, name !== null)) sync();
        onChange(path);
      });
    } catch {
      return; // gone between the walk and the watch: the next walk sees it again
    }
    watcher.on('error', () => drop(dir));
    watchers.set(dir, watcher);
  };
  // The parent, for the root's own coming and going.
  const PARENT = dirname(root);
  add(PARENT, (name) => (name === basename(root) ? root : null));
  sync();
  return {
    close() {
      closed = true;
      for (const dir of [...watchers.keys()]) drop(dir);
    },
  };
}
