/**
 * What one server process keeps on globalThis so that a dev-server reload (which re-evaluates every
 * module) reuses it instead of opening new connections: declared once here, so each holder reads
 * `globalThis.setwell…` with its type and no cast.
 */
import type { MikroORM } from '@mikro-orm/postgresql';
import type { Pool } from 'pg';
import type { Transporter } from 'nodemailer';
import type { S3Client } from '@aws-sdk/client-s3';
import type { Limiters } from '@/lib/rate-limit';

declare global {
  /** lib/db.ts: the ORM and its connection pool. */
  var setwellOrm: Promise<MikroORM> | undefined;
  /** lib/sql.ts: the pool of the hot-path plain SQL statements. */
  var setwellSqlPool: Pool | undefined;
  /** lib/mail.ts: the SMTP transport. */
  var setwellMailer: Transporter | undefined;
  /** lib/storage.ts: the S3 client. */
  var setwellS3: S3Client | undefined;
  /** lib/rate-limit.ts: the limiters and their pool. */
  var setwellLimiters: Limiters | undefined;
  /** lib/client-address.ts: whether the peer-address hook is installed. */
  var setwellPeerHook: boolean | undefined;
  /** app/api/bench/floor/route.ts: the bench's own pool. */
  var setwellBenchPool: Pool | undefined;
}

export {};
