/**
 * Column types MariaDB has and Drizzle's MySQL builder does not: binary large objects, read and
 * written as Buffers. Used by the schema files (schema.ts, schema-reference.ts).
 */
import { customType } from 'drizzle-orm/mysql-core';

/** MEDIUMBLOB: up to 16 MB (a stored share answer's gzip copy). */
export const mediumblob = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => 'mediumblob' });

/** LONGBLOB: up to 4 GB (an upload job's parsed payload). */
export const longblob = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => 'longblob' });
