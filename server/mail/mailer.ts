import nodemailer, { type Transporter } from 'nodemailer';
import type { Knex } from 'knex';
import type { AppConfig } from '../core/config';
import { deliverDue } from './outbox-service';

export function createTransport(config: AppConfig): Transporter {
  const local = config.smtp.host === '127.0.0.1' || config.smtp.host === 'localhost';
  return nodemailer.createTransport({
    host: config.smtp.host,
    port: config.smtp.port,
    secure: config.smtp.secure,
    ignoreTLS: local && !config.smtp.secure,
    auth: config.smtp.user ? { user: config.smtp.user, pass: config.smtp.password ?? '' } : undefined,
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 10000,
  });
}

/** Delivers the outbox every few seconds and whenever `kick()` is called. */
export function startOutboxWorker(knex: Knex, config: AppConfig, everyMs = 5000) {
  const transport = createTransport(config);
  let running = false;
  let again = false;
  const run = async () => {
    if (running) {
      again = true;
      return;
    }
    running = true;
    try {
      do {
        again = false;
        await deliverDue(knex, transport, config.mailFrom);
      } while (again);
    } catch (err) {
      console.error('Mail outbox:', (err as Error).message);
    } finally {
      running = false;
    }
  };
  const timer = setInterval(() => void run(), everyMs);
  timer.unref();
  return {
    kick: () => void run(),
    stop: () => {
      clearInterval(timer);
      transport.close();
    },
  };
}
