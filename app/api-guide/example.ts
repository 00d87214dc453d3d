import type { OpenApiDocument } from '@/lib/openapi/document';

/** Anchor id of an area's section. */
export function areaId(tag: string): string {
  return `area-${tag.toLowerCase().replace(/[^a-z0-9]+/g, '-')}`;
}

export const EXAMPLE_CSV = `elapsed_s,lux
0,400
30,398
60,395
90,391`;

const SELECTION = '{"time":{"column":0,"unit":"s"},"value":{"column":1}}';
const ITEM = 'glowmere-hearthglow-400';
const URL = 'http://localhost:3000/api/v1/field-tests/$FIELD_TEST_ID/readings';

/**
 * The readings upload as a shell command, in the media type the document lists for the route: the file
 * as the whole `text/csv` body with the trial's fields in the query, or else as a multipart form.
 */
export function readingsExample(doc: OpenApiDocument): { intro: string; csv: string; command: string; outro: string } {
  const content = doc.paths?.['/api/v1/field-tests/{id}/readings']?.post?.requestBody;
  const types = content && 'content' in content ? Object.keys(content.content ?? {}) : [];
  const intro =
    'A light-runtime test logged by a lux meter: time in seconds in the first column, the reading in the second. Make the field test first (`POST /api/v1/field-tests`, or the logbook), then send the file as one trial of one of its items:';
  const outro =
    'The server parses the file again and answers 201 with the trial’s id and the number of readings stored, or 422 listing the rows it could not read (leave them out with `dropRows`). Replace `localhost:3000` with the site’s address.';
  if (types.includes('text/csv')) {
    const command = [
      'curl --fail-with-body \\',
      '  -H "Authorization: Bearer $TRAILBENCH_TOKEN" \\',
      '  -H "Content-Type: text/csv" \\',
      '  --data-binary @log.csv \\',
      `  --url-query "item=${ITEM}" \\`,
      '  --url-query "label=run 1" \\',
      `  --url-query 'selection=${SELECTION}' \\`,
      `  "${URL}"`,
    ].join('\n');
    return { intro, csv: EXAMPLE_CSV, command, outro: `${outro} \`--url-query\` needs curl 7.87 or later; it encodes each value for the address.` };
  }
  const command = [
    'curl --fail-with-body \\',
    '  -H "Authorization: Bearer $TRAILBENCH_TOKEN" \\',
    '  -F "file=@log.csv;type=text/csv" \\',
    `  -F "item=${ITEM}" \\`,
    '  -F "label=run 1" \\',
    `  -F 'selection=${SELECTION}' \\`,
    `  "${URL}"`,
  ].join('\n');
  return { intro, csv: EXAMPLE_CSV, command, outro };
}
