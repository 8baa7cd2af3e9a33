'use client';

import { useState } from 'react';
import { compressionLevels, defaultPressureBands, type CompressionLevel } from '@/lib/fit/compression-target';
import type { SizeSpec } from '@/lib/fit/spec';
import type { FitTexture } from '@/lib/db/fit';
import { Card } from '@/components/ui/card';
import { Field, Input, Select } from '@/components/ui/field';

const levelLabels: Record<CompressionLevel, string> = { mild: 'Mild', moderate: 'Moderate', firm: 'Firm' };

/** Which textures set needles and compression, the cylinders on offer, the target band. */
export function FitSettingsCard({
  spec, textures, readOnly, construction, onChange,
}: {
  spec: SizeSpec;
  textures: readonly FitTexture[];
  readOnly: boolean;
  construction: 'seamless' | 'flat';
  onChange: (spec: SizeSpec) => void;
}) {
  const [cylText, setCylText] = useState<string | null>(null);
  const [cylError, setCylError] = useState<string | null>(null);
  const withCurve = textures.filter((t) => t.forceExtension);
  const commitCylinders = () => {
    if (cylText === null) return;
    const parts = cylText.split(/[\s,;]+/).filter(Boolean).map((p) => Number(p.replace(/(in|″|")$/i, '')));
    if (parts.length === 0 || parts.some((n) => !Number.isFinite(n) || n <= 0 || n > 40)) {
      setCylError('List diameters in inches, e.g. 12, 13, 14 (each above 0 and at most 40).');
      return;
    }
    setCylError(null);
    setCylText(null);
    onChange({ ...spec, cylinderDiametersIn: [...new Set(parts)].sort((a, b) => a - b) });
  };
  const setBand = (level: CompressionLevel, key: 'minMmHg' | 'maxMmHg', raw: string) => {
    const n = Number(raw.replace(',', '.'));
    if (!Number.isFinite(n) || n < 0) return;
    onChange({ ...spec, target: { ...spec.target, bands: { ...spec.target.bands, [level]: { ...spec.target.bands[level], [key]: n } } } });
  };
  const band = spec.target.bands[spec.target.level];
  const bandWrong = !(band.maxMmHg > band.minMmHg);
  return (
    <Card title="Fit settings">
      <div className="space-y-3">
        <Field label="Base texture (sets the needles)" hint="Its relaxed density: wales and courses per cm.">
          {(id) => (
            <Select id={id} disabled={readOnly} value={spec.baseTextureId ?? ''} onChange={(e) => onChange({ ...spec, baseTextureId: e.target.value || null })}>
              {textures.length === 0 ? <option value="">No textures on this style</option> : null}
              {textures.map((t) => (
                <option key={t.id} value={t.id}>{t.name} · {t.walesPerCm} × {t.coursesPerCm} /cm</option>
              ))}
            </Select>
          )}
        </Field>
        <Field
          label="Compression texture"
          hint={withCurve.length ? `Its force–extension test gives the tension (${textures.find((t) => t.id === spec.compressionTextureId)?.forceExtension?.length ?? 0} test points).` : 'No texture of the style has a force–extension test.'}
        >
          {(id) => (
            <Select id={id} disabled={readOnly} value={spec.compressionTextureId ?? ''} onChange={(e) => onChange({ ...spec, compressionTextureId: e.target.value || null })}>
              <option value="">None</option>
              {withCurve.map((t) => (
                <option key={t.id} value={t.id}>{t.name}</option>
              ))}
            </Select>
          )}
        </Field>
        {construction === 'seamless' ? (
          <Field label="Cylinders at the mill (in)" error={cylError ?? undefined} hint="Body-size diameters to choose from at the style’s gauge.">
            {(id) => (
              <Input
                id={id}
                className="figures"
                disabled={readOnly}
                value={cylText ?? spec.cylinderDiametersIn.join(', ')}
                onChange={(e) => setCylText(e.target.value)}
                onBlur={commitCylinders}
                onKeyDown={(e) => { if (e.key === 'Enter') commitCylinders(); }}
              />
            )}
          </Field>
        ) : null}
        <fieldset>
          <legend className="mb-1 text-xs font-medium text-ink-soft">Target compression band (mmHg)</legend>
          <table className="w-full text-xs">
            <tbody>
              {compressionLevels.map((level) => (
                <tr key={level} className={spec.target.level === level ? 'bg-spruce-50' : ''}>
                  <td className="py-1 pl-1">
                    <label className="flex items-center gap-1.5">
                      <input
                        type="radio"
                        name="compression-level"
                        disabled={readOnly}
                        checked={spec.target.level === level}
                        onChange={() => onChange({ ...spec, target: { ...spec.target, level } })}
                      />
                      {levelLabels[level]}
                    </label>
                  </td>
                  {(['minMmHg', 'maxMmHg'] as const).map((k) => (
                    <td key={k} className="py-1 pr-1">
                      <input
                        aria-label={`${levelLabels[level]} band ${k === 'minMmHg' ? 'from' : 'to'} (mmHg)`}
                        className="figures h-7 w-16 rounded border border-rule-strong bg-panel px-1.5 text-right text-xs disabled:bg-paper"
                        inputMode="decimal"
                        disabled={readOnly}
                        defaultValue={spec.target.bands[level][k]}
                        key={`${level}-${k}-${spec.target.bands[level][k]}`}
                        onBlur={(e) => setBand(level, k, e.target.value)}
                      />
                    </td>
                  ))}
                  <td className="figures py-1 text-right text-2xs text-ink-faint">{defaultPressureBands[level].minMmHg}–{defaultPressureBands[level].maxMmHg}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="mt-1 text-2xs text-ink-faint">Right: defaults from common practice for sports garments, no published source; not the classes of medical compression.</p>
          {bandWrong ? <p role="alert" className="mt-1 text-xs text-madder-700">The upper limit must be above the lower one.</p> : null}
        </fieldset>
      </div>
    </Card>
  );
}
