// `npm run bench -- sweep`: only the experiments' throughput (needs DATABASE_URL). Run under
// tsx, apart from the bundled runner, because it drives the database and worker processes.
import { sweepThroughput } from "./sweep-throughput";

sweepThroughput()
  .then((lines) => console.log(lines.join("\n")))
  .catch((e) => {
    console.error(e);
    process.exitCode = 1;
  });
