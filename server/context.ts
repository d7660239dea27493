// What the Express app and the worker are built from. Tests build their own.
import type { Redis } from 'ioredis';
import type { PassportStatic } from 'passport';
import type { DataSource } from 'typeorm';
import type { Config } from './config';
import type { Queues } from './lib/queues';
import type { Storage } from './lib/storage';

export interface AppContext {
  config: Config;
  dataSource: DataSource;
  redis: Redis;
  queues: Queues;
  passport: PassportStatic;
  storage: Storage;
  close?: () => Promise<void>;
}
