/**
 * The local S3 fake: s3rver on 127.0.0.1:$S3_FAKE_PORT, keeping its objects in $SETWELL_HOME/s3
 * (outside the repository: the build's file scanners must never see it). The start command
 * and the tests run it so no photo leaves the machine. Never used in production: point
 * S3_ENDPOINT at a real S3-compatible store there.
 */
import fs from 'node:fs';
import path from 'node:path';
import { ensureBucket } from '../lib/storage';

interface S3rverServer {
  run(): Promise<{ address: string; port: number }>;
  close(): Promise<void>;
}
type S3rverConstructor = new (options: {
  address: string;
  port: number;
  directory: string;
  silent: boolean;
  configureBuckets: Array<{ name: string }>;
}) => S3rverServer;

// s3rver ships no type declarations; this is the part of its API we use.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const S3rver = require('s3rver') as S3rverConstructor;

const port = Number(process.env.S3_FAKE_PORT ?? 4569);
const home = process.env.SETWELL_HOME;
const repoRoot = path.resolve(__dirname, '..');

function storeDirectory(): string {
  if (!home) {
    console.error('s3 fake: SETWELL_HOME is not set (source scripts/env.sh first)');
    process.exit(1);
  }
  const dir = path.resolve(home, 's3');
  const relative = path.relative(repoRoot, dir);
  if (!relative.startsWith('..') && !path.isAbsolute(relative)) {
    console.error(`s3 fake: refusing to keep objects inside the repository (${dir})`);
    process.exit(1);
  }
  fs.mkdirSync(dir, { recursive: true });
  return dir;
}

async function main() {
  const directory = storeDirectory();
  const bucket = process.env.S3_BUCKET ?? 'setwell';
  // The bucket exists before the port opens, so whoever waits for the port finds it ready;
  // ensureBucket then proves the fake answers signed S3 requests as the app will send them.
  const server = new S3rver({ address: '127.0.0.1', port, directory, silent: true, configureBuckets: [{ name: bucket }] });
  await server.run();
  await ensureBucket();
  console.log(`s3 fake: http://127.0.0.1:${port}, bucket ${bucket}, objects in ${directory}`);

  for (const signal of ['SIGINT', 'SIGTERM'] as const) {
    process.on(signal, () => {
      server.close().finally(() => process.exit(0));
      setTimeout(() => process.exit(0), 1000).unref();
    });
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
