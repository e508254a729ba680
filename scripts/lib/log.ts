/** One-line status messages with a source tag, e.g. "[db] PostgreSQL listening on …". */
export function log(tag: string, message: string) {
  console.log(`[${tag}] ${message}`);
}
