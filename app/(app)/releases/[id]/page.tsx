import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can, isOutsideRole } from '@/lib/auth/roles';
import { findRelease } from '@/lib/db/releases';
import { listOrganisations } from '@/lib/db/organisations';
import { renderTile, repeatsForMinSize } from '@/lib/knit/render';
import { drawingToSvg } from '@/lib/knit/render-svg';
import { packSummary, packTextureColours, packYarnColours, standardHex, textureFacts, yarnColourStandards, yarnCountText } from '@/lib/mill/pack-data';
import { releaseParamsSchema } from '@/lib/validations/mill';
import { Card, Notice, PageHeader } from '@/components/ui/card';
import { ExportsPanel } from '@/components/mill/exports-panel';
import { PanelSvg } from '@/components/mill/panel-svg';
import { AskForReview, ReviewActions } from '@/components/mill/review-actions';

export const metadata: Metadata = { title: 'Released revision' };

const reviewWords = { pending: 'Waiting for the decision', approved: 'Approved', 'changes-requested': 'Changes asked' } as const;

/** A released revision as it was released: everything read from its frozen snapshot. */
export default async function ReleasePage({ params }: { params: Promise<{ id: string }> }) {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  const parsed = releaseParamsSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const release = await findRelease(user, parsed.data.id);
  if (!release) notFound();
  const data = release.snapshot;
  const facts = textureFacts(data);
  const summary = packSummary(data);
  const index = packTextureColours(data);
  const yarnHex = packYarnColours(data);
  const names = Object.fromEntries(data.textures.map((t) => [t.id, t.name]));
  const standards = [...(data.colour?.standards ?? []), ...yarnColourStandards(data)];
  const myReview = release.reviews.find((r) => r.organisationId === user.organisationId);
  const clients = can(user.role, 'style:release') ? (await listOrganisations(user.studioId)).filter((o) => o.kind === 'client') : [];
  const canComment = user.role === 'client' ? !!myReview : can(user.role, 'style:edit');
  return (
    <>
      <PageHeader
        eyebrow={<a href={isOutsideRole(user.role) ? '/styles' : `/styles/${release.styleId}/mill-pack`} className="hover:text-ink">{release.styleCode} · released revisions</a>}
        title={<span>{release.styleCode} {release.styleName} · <span className="figures">revision {release.revision}</span></span>}
      >
        <p className="mt-1 text-sm text-ink-soft">
          Released <time className="figures" dateTime={release.releasedAt}>{release.releasedAt.slice(0, 16).replace('T', ' ')}</time> by {release.releasedBy ?? '—'}{release.mills.length ? ` to ${release.mills.map((m) => m.name).join(', ')}` : ''}. This is the revision as it was released; later edits to the style do not change it.
        </p>
        {release.note ? <p className="mt-1 text-sm">Note: {release.note}</p> : null}
      </PageHeader>
      <div className="grid grid-cols-1 gap-5 xl:grid-cols-[1fr_380px]">
        <div className="space-y-5">
          {can(user.role, 'mill:download') ? (
            <ExportsPanel choices={{ styleId: release.styleId, releaseId: release.id, title: `Mill pack · revision ${release.revision}`, textures: data.textures.map((t) => ({ id: t.id, name: t.name })), panels: data.panels.map((p) => ({ id: p.id, name: p.name })) }} />
          ) : null}
          {user.role === 'mill' ? (
            <Notice>Knit a test piece of each texture and send the photo and figures under <a className="font-medium underline" href={`/styles/${release.styleId}/test-knits`}>Test knits</a>.</Notice>
          ) : null}
          <Card title="Body map">
            <div className="flex flex-wrap gap-6">
              {data.panels.map((p) => {
                const base = data.textures.find((t) => t.id === p.baseTextureId);
                return <PanelSvg key={p.id} panel={p} colours={index} names={names} walesPerCm={base?.density.walesPerCm ?? 20} coursesPerCm={base?.density.coursesPerCm ?? 28} />;
              })}
            </div>
          </Card>
          <Card title="Textures">
            <ul className="grid grid-cols-1 gap-4 md:grid-cols-2">
              {facts.map((f) => {
                // A small tile of whole repeats, repeated by the browser (magnified 3×): it tiles with no seam.
                const reps = repeatsForMinSize(f.texture, 100, 40);
                const tile = renderTile(f.texture, yarnHex, { ...reps, pxPerCm: 100 });
                const url = `url("data:image/svg+xml,${encodeURIComponent(drawingToSvg(tile))}")`;
                return (
                  <li key={f.texture.id} className="flex gap-3">
                    <div
                      role="img"
                      aria-label={`${f.texture.name}, rendered, magnified 3×`}
                      className="h-40 w-40 shrink-0 rounded border border-rule"
                      style={{ backgroundImage: url, backgroundSize: `${tile.widthPx * 3}px ${tile.heightPx * 3}px`, backgroundRepeat: 'repeat' }}
                    />
                    <div className="text-sm">
                      <div className="flex items-center gap-2 font-medium"><span className="inline-block h-3 w-3 rounded-sm" style={{ background: f.indexHex }} />{f.texture.name}</div>
                      <div className="figures text-ink-soft">{f.texture.repeat.needles} × {f.texture.repeat.courses} · {f.repeatMm.widthMm.toFixed(2)} × {f.repeatMm.heightMm.toFixed(2)} mm</div>
                      <div className="figures text-ink-soft">{f.texture.density.walesPerCm} wales/cm · {f.texture.density.coursesPerCm} courses/cm</div>
                      <div className="figures text-ink-soft">{f.gsm === null ? '—' : `${f.gsm.toFixed(0)} g/m² est.`}</div>
                      <ul className="mt-1 text-xs text-ink-soft">
                        {f.feeders.map((l) => <li key={l.letter}>{l.letter}: {l.ground.name}{l.plated ? ` + ${l.plated.name} (draft ${l.plated.draft})` : ''}</li>)}
                      </ul>
                    </div>
                  </li>
                );
              })}
            </ul>
          </Card>
        </div>
        <div className="space-y-5">
          {release.reviews.length || clients.length ? (
            <Card title="Client review">
              {release.reviews.length ? (
                <ul className="mb-3 space-y-1 text-sm">
                  {release.reviews.map((r) => (
                    <li key={r.organisationId}><span className="font-medium">{r.organisationName}</span>: {reviewWords[r.status]}{r.decidedBy ? ` (${r.decidedBy})` : ''}{r.comment ? ` — “${r.comment}”` : ''}</li>
                  ))}
                </ul>
              ) : null}
              {clients.length ? <AskForReview releaseId={release.id} clients={clients.map((c) => ({ id: c.id, name: c.name }))} /> : null}
              <div className="mt-3">
                <ReviewActions releaseId={release.id} canDecide={user.role === 'client' && !!myReview} canComment={canComment} />
              </div>
            </Card>
          ) : null}
          {release.comments.length ? (
            <Card title="Comments">
              <ol className="space-y-2 text-sm">
                {release.comments.map((c) => (
                  <li key={c.id}><span className="font-medium">{c.userName ?? '—'}</span>{c.organisationName ? ` (${c.organisationName})` : ''} <time className="figures text-xs text-ink-faint">{c.createdAt.slice(0, 16).replace('T', ' ')}</time><p className="text-ink-soft">{c.body}</p></li>
                ))}
              </ol>
            </Card>
          ) : null}
          <Card title="Fibre content label">
            {summary.labels ? (
              <div className="space-y-2 text-sm">
                <p><span className="text-xs text-ink-faint">EU</span><br /><span className="font-medium">{summary.labels.eu.text}</span></p>
                <p><span className="text-xs text-ink-faint">US</span><br /><span className="font-medium">{summary.labels.us.text}</span></p>
              </div>
            ) : <p className="text-sm text-ink-soft">Not computed.</p>}
          </Card>
          <Card title="Colours">
            {!data.colour ? <p className="mb-2 text-xs text-ink-soft">No colourway recorded for this revision.</p> : <p className="mb-2 text-sm">{data.colour.colourwayName}</p>}
            <ul className="space-y-1.5 text-sm">
              {standards.map((s) => (
                <li key={`${s.name}-${s.yarnIds.join()}`} className="flex items-center gap-2">
                  <span className="inline-block h-4 w-6 rounded-sm border border-rule" style={{ background: standardHex(s) }} />
                  {s.name} <span className="figures text-xs text-ink-faint">L* {s.lab.L.toFixed(1)} a* {s.lab.a.toFixed(1)} b* {s.lab.b.toFixed(1)}</span>
                </li>
              ))}
            </ul>
          </Card>
          <Card title="Yarns">
            <ul className="space-y-1 text-sm">
              {data.yarns.map((y) => <li key={y.id}>{y.name} <span className="figures text-xs text-ink-faint">{yarnCountText(y)}</span></li>)}
            </ul>
          </Card>
        </div>
      </div>
    </>
  );
}
