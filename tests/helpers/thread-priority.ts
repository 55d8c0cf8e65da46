// Nice values of this process's threads, read from /proc (Linux keeps one per thread; proc(5):
// /proc/[pid]/task/[tid]/stat, field 19).
import fs from 'node:fs';

/** Field 19 of a stat line; the command name in parentheses may hold spaces, so fields are counted after it. */
export function niceOf(statFile: string): number {
  const stat = fs.readFileSync(statFile, 'utf8');
  return Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[16]);
}

/** The process's main thread. */
export const mainThreadNice = () => niceOf(`/proc/self/task/${process.pid}/stat`);

/** Every thread of this process, the main one included. */
export const threadNices = () => fs.readdirSync('/proc/self/task').map((tid) => niceOf(`/proc/self/task/${tid}/stat`));
