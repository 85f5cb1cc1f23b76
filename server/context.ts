import type { Passport } from 'passport';
import type { DataSource } from 'typeorm';
import type { Env } from './config/env';
import type { SmtpSink } from './infra/smtp-sink';
import type { Logger } from './lib/logger';
import type { Mailer } from './lib/mailer';
import type { ObjectStorage } from './lib/object-storage';

/** What route factories and services receive: the app's shared dependencies. */
export interface AppContext {
  ds: DataSource;
  env: Env;
  logger: Logger;
  mailer: Mailer;
  /** The development SMTP sink, when one runs in this process (admin outbox page). */
  outbox: SmtpSink | null;
  storage: ObjectStorage;
  passport: InstanceType<typeof Passport>;
  publicUrl: string;
  /** The current time; tests replace it to move through a season. */
  now: () => Date;
}
