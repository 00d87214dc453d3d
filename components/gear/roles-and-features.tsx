import type { SpecLine, WorkingCopy } from '@/db/gear';
import { CATEGORY_DEFS } from '@/lib/gear/categories';
import { checklistLines, FEATURE_DEFS, FEATURE_STATE_LABELS, type ChecklistLine } from '@/lib/gear/features';
import { alsoServesText, roleNoun, rolesOf } from '@/lib/gear/roles';
import type { UnitSystem } from '@/lib/units/display';
import { formatSpecIn } from '@/lib/units/format';

/** "Also serves as a power bank" under the item's name (nothing for a single-role item). */
export function AlsoServesLine({ version }: { version: Pick<WorkingCopy, 'alsoServesAs'> }) {
  const text = alsoServesText(version.alsoServesAs);
  if (!text) return null;
  return (
    <p className="inline-flex items-center gap-2 rounded-md bg-lichen-tint px-3 py-1.5 text-sm font-semibold" data-testid="also-serves-as">
      {text}
    </p>
  );
}

const STATE_MARK: Record<ChecklistLine['state'], string> = { has: '✓', 'has-not': '✗', 'not-stated': '–' };
const STATE_STYLE: Record<ChecklistLine['state'], string> = {
  has: 'border-lichen text-lichen-dark',
  'has-not': 'border-rule text-ink',
  'not-stated': 'border-dashed border-rule text-slate',
};

/**
 * What each extra role offers (the specs that role records, with the figures this item has) and the
 * feature checklist of all its roles: has / has not / not stated, in words and a mark (not colour alone).
 */
export function RolesAndFeatures({ version, lines, units }: { version: WorkingCopy; lines: readonly SpecLine[]; units: UnitSystem }) {
  const roles = rolesOf(version.category, version.alsoServesAs);
  const checklist = checklistLines(roles, version.features, version.waterRating);
  const itemLines = new Map(lines.filter((l) => l.mode === '').map((l) => [l.key, l]));
  return (
    <>
      {version.alsoServesAs.map((role) => {
        const def = CATEGORY_DEFS[role];
        const figures = def.specs
          .filter((s) => s.key !== 'mass')
          .map((s) => ({ spec: s, line: itemLines.get(s.key) }))
          .filter((x) => x.line && (x.line.claimed || x.line.measured));
        return (
          <section key={role} aria-labelledby={`role-${role}-heading`} className="space-y-2 rounded-lg border border-rule p-4" data-testid={`role-${role}`}>
            <h2 id={`role-${role}-heading`} className="text-lg font-bold">
              Also serves as {roleNoun(role)}
            </h2>
            <p className="text-sm text-slate">
              This {CATEGORY_DEFS[version.category].label.toLowerCase()} also does the job of {roleNoun(role)}: it appears when you browse {def.plural.toLowerCase()}
              {role === 'power-bank' || role === 'battery-12v' ? ', and its rated energy counts as stored energy in kits' : ''}.
            </p>
            {figures.length ? (
              <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
                {figures.map(({ spec, line }) => {
                  const value = line!.measured?.value ?? line!.claimed!.value;
                  return (
                    <div key={spec.key} data-testid={`role-spec-${spec.key}`}>
                      <dt className="text-slate">As {roleNoun(role)}: {spec.label.charAt(0).toLowerCase() + spec.label.slice(1)}</dt>
                      <dd className="figure font-mono">
                        {formatSpecIn(spec.key, value, units)} <span className="text-xs text-slate">{line!.measured ? 'measured' : 'claimed'}</span>
                      </dd>
                    </div>
                  );
                })}
              </dl>
            ) : (
              <p className="text-sm text-slate">No {def.label.toLowerCase()} figures stated yet.</p>
            )}
          </section>
        );
      })}

      <section aria-labelledby="features-heading" className="space-y-3">
        <h2 id="features-heading" className="text-xl font-bold">
          Features
        </h2>
        <p className="text-sm text-slate">
          The checklist of {roles.map((r) => CATEGORY_DEFS[r].plural.toLowerCase()).join(' and ')}, as the author stated it. “Not stated” means nobody has said
          either way.
        </p>
        <ul className="grid gap-2 sm:grid-cols-2" data-testid="feature-checklist">
          {checklist.map((line) => (
            <li key={line.name} className={`flex items-start gap-3 rounded-md border px-3 py-2 text-sm ${STATE_STYLE[line.state]}`} data-testid={`feature-${line.name}`} data-state={line.state}>
              <span aria-hidden="true" className="w-4 shrink-0 text-center font-mono font-bold">
                {STATE_MARK[line.state]}
              </span>
              <span className="min-w-0">
                <span className="font-semibold text-ink">{line.label}</span>
                {line.detail ? <span className="text-ink"> ({FEATURE_DEFS[line.name].detail ? `${FEATURE_DEFS[line.name].detail!.label.toLowerCase()}: ` : ''}{line.detail})</span> : null}
                <span className="block text-xs">{FEATURE_STATE_LABELS[line.state]}</span>
              </span>
            </li>
          ))}
        </ul>
      </section>
    </>
  );
}
