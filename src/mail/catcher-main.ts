/**
 * The mail catcher as a program (`npm start` runs it; alone: `npx tsx src/mail/catcher-main.ts`), listening on
 * 127.0.0.1:SMTP_PORT (default 2525) until SIGINT/SIGTERM.
 */
import { settings } from '@/src/settings';
import { startCatcher } from './catcher';

const port = settings().SMTP_PORT;
startCatcher({ port, log: (l) => console.log(l) })
  .then((c) => {
    console.log(`[mail] catcher listening on 127.0.0.1:${c.port}`);
    const stop = () => void c.close().then(() => process.exit(0));
    process.on('SIGINT', stop);
    process.on('SIGTERM', stop);
  })
  .catch((err: Error) => {
    console.error(`[mail] cannot listen on 127.0.0.1:${port}: ${err.message} (set SMTP_PORT to a free port)`);
    process.exit(1);
  });
