import pino from 'pino';

export type Logger = pino.Logger;

export function createLogger(level: string) {
  return pino({ level, base: undefined, timestamp: pino.stdTimeFunctions.isoTime });
}
