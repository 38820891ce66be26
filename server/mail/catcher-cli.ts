// `tsx server/mail/catcher-cli.ts`: runs the SMTP catcher until stopped. Started by scripts/services.sh.
import { config } from '@/server/config';
import { startMailCatcher } from './catcher';

startMailCatcher({ port: config.mail.port, dir: config.mail.caughtDir })
  .then(() =>
    console.log(
      `[tactus] mail catcher on smtp://127.0.0.1:${config.mail.port}, keeping mail in ${config.mail.caughtDir}`,
    ),
  )
  .catch((err: NodeJS.ErrnoException) => {
    if (err.code === 'EADDRINUSE') {
      console.log(`[tactus] mail catcher already listening on port ${config.mail.port}`);
      process.exit(0);
    }
    console.error(err);
    process.exit(1);
  });
