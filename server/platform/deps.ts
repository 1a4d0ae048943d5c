import type { Knex } from 'knex';
import type { Background } from './background';
import type { Clock } from './clock';
import type { Config } from './config';
import type { Logger } from './logger';
import type { Mailer } from './mailer';

/** What every domain is given: the database, the configuration, the mailer, the log and the clock. */
export interface AppDeps {
  db: Knex;
  config: Config;
  mailer: Mailer;
  logger: Logger;
  /** The current instant; tests pin it (`fixedClock`). */
  clock: Clock;
  /** Work done after the answer has gone; made by createApp. */
  background: Background;
}

/** What createApp is given: everything but what it makes itself. */
export type AppInput = Omit<AppDeps, 'background'>;
