import { join } from 'node:path';
import { pino } from 'pino';
import { createApp } from './app';
import { ConfigError, loadConfig } from './config';
import { openDatabase } from './db';
import { seedDemo } from './seed/seeder';
import { startMail } from './modules/mail/mail-runtime';
import { createStorage, describeStorage } from './storage/create-storage';
import { requeuePendingPhotos } from './modules/holes/photos.service';
import { User } from './modules/users/user.entity';
import { DEMO_USERS } from '../seeds/demo';

/** Start Threadline: migrate, seed the demo scenario into an empty database, listen. */
async function main(): Promise<void> {
  let config;
  try {
    config = loadConfig();
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(1);
    }
    throw err;
  }
  const logger = pino({ level: config.logLevel });
  const orm = await openDatabase(config.databasePath);
  const storage = createStorage(config);

  let seeded = false;
  if (config.seedDemo && (await orm.em.fork().count(User, {})) === 0) {
    const report = await seedDemo(orm.em, storage);
    seeded = report.usersCreated > 0;
    logger.info({ projects: report.projectsCreated }, 'demo scenario loaded');
  }

  // Photos whose thumbnails were not made before the last stop are queued again.
  const requeued = await requeuePendingPhotos(orm.em, storage, logger);
  if (requeued > 0) logger.info({ photos: requeued }, 'photo thumbnails queued again after a restart');

  // Mail: the outbox worker runs in this process (never started by createApp, so tests drive it).
  const mail = await startMail(config, orm, logger);
  mail.worker.start();

  const app = createApp({ orm, config, storage, logger, clientDir: join(process.cwd(), 'dist'), mail });
  const server = app.listen(config.port, config.host, (err?: Error) => {
    if (err) {
      console.error(`Could not listen on ${config.host}:${config.port}: ${err.message}. Set PORT to a free port.`);
      process.exit(1);
    }
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : config.port;
    const host = config.host === '0.0.0.0' ? 'localhost' : config.host;
    const lines = [``, `Threadline is running at http://${host}:${port}/`, `Database: ${config.databasePath}`, `Files: ${describeStorage(config)}`];
    if (config.seedDemo) {
      lines.push(seeded ? 'Demo scenario loaded. Demo sign-ins:' : 'Demo sign-ins (if unchanged):');
      for (const u of DEMO_USERS.filter((d) => d.active !== false)) lines.push(`  ${u.role.padEnd(9)} ${u.email.padEnd(34)} ${u.password}`);
    }
    console.log(lines.join('\n') + '\n');
  });

  const shutdown = () => {
    server.close(() => void mail.close().then(() => orm.close()).then(() => process.exit(0)));
    setTimeout(() => process.exit(0), 3000).unref();
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
}

void main();
