// The PDF check's own process, forked by pdf-check.ts for each upload: argv holds the file and
// the options (JSON); the one answer goes back over IPC, then the process exits. Its memory
// (qpdf's JSON of a large file, the unpacking) and its time never reach the API's event loop,
// and the API kills it when it runs past its time limit.
import { inspectFile, type InspectOptions } from './pdf-inspect';

const [file, options] = process.argv.slice(2);

function answer(message: unknown, code: number) {
  if (process.send) process.send(message, () => process.exit(code));
  else process.exit(code);
}

inspectFile(file, JSON.parse(options) as InspectOptions).then(
  (result) => answer(result, 0),
  (error: unknown) =>
    answer({ ok: false, refusal: 'failed', message: (error as Error)?.message ?? String(error) }, 1),
);
