/** Runs the SMTP stand-in as its own process (started by `npm start`). */
import { loadConfig } from '../config';
import { startMailStandIn } from './mail-stand-in';

const config = loadConfig();
startMailStandIn({ port: config.smtp.port, mailDir: config.mailDir })
  .then(({ port, close }) => {
    console.log(
      `[mail] stand-in listening on 127.0.0.1:${port}, keeping messages in ${config.mailDir}`,
    );
    const stop = () => void close().then(() => process.exit(0));
    process.on('SIGTERM', stop);
    process.on('SIGINT', stop);
  })
  .catch((error: unknown) => {
    console.error(`[mail] could not start the stand-in: ${String(error)}`);
    process.exit(1);
  });
