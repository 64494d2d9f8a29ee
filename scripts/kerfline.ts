/** Command-line entry: `npm run --silent kerfline -- layout <design.json> --format csv|json` or `-- check <design.json> <measurements.csv>`. */
import { runKerfline } from '~/lib/cli/run-kerfline.server.ts';

process.exitCode = await runKerfline(process.argv.slice(2), {
  stdout: (text) => process.stdout.write(text),
  stderr: (text) => process.stderr.write(text),
});
