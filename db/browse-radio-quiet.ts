/**
 * The `radioQuiet` filter of `GET /api/v1/gear` as SQL on the item `g`: for each S-meter range the
 * filter names, the item's measured noise-rise spec exists and is under the quiet threshold. Only
 * measured rows count (the spec is measured-only; lib/browse/radio-quiet.ts).
 */
import { sql, type SQL } from 'drizzle-orm';
import { RADIO_QUIET_BELOW_DB, radioQuietSpecKeys, type RadioQuietFilter } from '@/lib/browse/radio-quiet';

export function radioQuietCondition(filter: RadioQuietFilter): SQL {
  const parts = radioQuietSpecKeys(filter).map(
    (key) => sql`EXISTS (SELECT 1 FROM specs s WHERE s.gear_item_id = g.id AND s.key = ${key} AND s.mode = '' AND s.basis = 'measured' AND s.value < ${RADIO_QUIET_BELOW_DB})`,
  );
  return sql.join(parts, sql` AND `);
}
