import { Op } from 'sequelize';
import type { Extra, Product } from '../../../shared/api/settings';
import { extrasFor } from '../../../shared/quote/extras';
import { spaceForQuote } from '../../../shared/quote/from-takeoff';
import { multiplyMinor } from '../../../shared/quote/money';
import { loftShapeOf, type JobFacts, type ProductFacts } from '../../../shared/reports/estimate-vs-actual';
import { jobRollsByProduct } from '../../../shared/takeoff/job-roll-plan';
import { readStoredTakeoff } from '../../../shared/takeoff/takeoff-schema';
import type { Takeoff } from '../../../shared/takeoff/takeoff-types';
import { Job, JobActual, JobCompletion, Quote, QuoteLine, User } from '../../db/models';
import type { CompanySetting } from '../../db/models';
import { latestRevisionsOfJobs } from '../plan-revisions/revisions.repository';

type Catalogue = { products: readonly Product[]; extras: readonly Extra[] };

/**
 * The facts of each finished job (marked installed, with its completion) for the comparison: the
 * stored takeoffs of its spaces' latest revisions, its accepted quote's lines and costs, and what
 * was recorded on finishing. Estimated hours are the quote's labour lines (as the customer was
 * charged); without an accepted quote, the company's rates on the takeoff's areas.
 */
export async function finishedJobFacts(organisationId: string, jobIds: readonly string[], settings: CompanySetting, catalogue: Catalogue): Promise<JobFacts[]> {
  if (jobIds.length === 0) return [];
  const ids = [...jobIds];
  const [jobs, completions, actuals, revisions, quotes] = await Promise.all([
    Job.findAll({ where: { organisationId, id: { [Op.in]: ids } } }),
    JobCompletion.findAll({ where: { organisationId, jobId: { [Op.in]: ids } } }),
    JobActual.findAll({ where: { organisationId, jobId: { [Op.in]: ids } } }),
    latestRevisionsOfJobs(ids),
    Quote.findAll({
      where: { organisationId, jobId: { [Op.in]: ids }, status: 'accepted' },
      include: [{ model: QuoteLine, as: 'lines' }],
      order: [['version', 'DESC']],
    }),
  ]);
  const userIds = new Set<string>();
  for (const a of actuals) for (const h of a.hours) userIds.add(h.userId);
  for (const r of revisions) if (r.revision?.authorId) userIds.add(r.revision.authorId);
  for (const j of jobs) if (j.createdById) userIds.add(j.createdById);
  const users = new Map((await User.findAll({ where: { id: { [Op.in]: [...userIds] } } })).map((u) => [u.id, u.name]));
  const lab = settings.labour;

  const out: JobFacts[] = [];
  for (const job of jobs) {
    const completion = completions.find((c) => c.jobId === job.id);
    if (!completion) continue;
    const actual = actuals.find((a) => a.jobId === job.id) ?? null;
    const mine = revisions.filter((r) => r.space.jobId === job.id);
    const takeoffs: Takeoff[] = [];
    let biggest: { area: number; corners: number; authorId: string | null } = { area: -1, corners: 4, authorId: null };
    for (const r of mine) {
      const t = readStoredTakeoff(r.revision?.takeoff);
      if (!t) continue;
      takeoffs.push(t);
      const corners = Array.isArray((r.revision?.plan as { outline?: unknown[] })?.outline) ? (r.revision!.plan as { outline: unknown[] }).outline.length : 4;
      if (t.netAreaM2 > biggest.area) biggest = { area: t.netAreaM2, corners, authorId: r.revision?.authorId ?? null };
    }
    const quote = quotes.find((q) => q.jobId === job.id);
    const lines = quote?.lines ?? [];
    const pooled = jobRollsByProduct(takeoffs);
    const products = new Map<string, ProductFacts>();
    const areaM2 = { base: 0, cross: 0 };
    for (const t of takeoffs)
      for (const l of t.layers) {
        areaM2[l.role] += l.areaM2;
        const cat = catalogue.products.find((p) => p.id === l.productId);
        const p = products.get(l.productId) ?? {
          productId: l.productId,
          productName: cat?.name ?? l.productName,
          areaM2: 0,
          coverageM2: cat?.coverageM2 ?? l.coverageM2PerRoll,
          byPacking: 0,
          byRuleOfThumb: 0,
          used: null,
          returned: null,
          unitCostMinor: lines.find((x) => x.kind === 'material' && x.productId === l.productId)?.unitCostMinor ?? cat?.unitCostMinor ?? 0,
        };
        p.areaM2 += l.areaM2;
        p.byPacking += l.rollsByPacking;
        p.byRuleOfThumb += l.rollsByArea;
        products.set(l.productId, p);
      }
    for (const [id, n] of pooled) {
      const p = products.get(id);
      if (p) p.byPacking = n;
    }
    for (const r of actual?.rolls ?? []) {
      const cat = catalogue.products.find((p) => p.id === r.productId);
      const p = products.get(r.productId) ?? {
        productId: r.productId,
        productName: cat?.name ?? 'Product not on the plan',
        areaM2: 0,
        coverageM2: cat?.coverageM2 ?? 0,
        byPacking: 0,
        byRuleOfThumb: 0,
        used: null,
        returned: null,
        unitCostMinor: cat?.unitCostMinor ?? 0,
      };
      products.set(r.productId, { ...p, used: r.used, returned: r.returned });
    }
    const needs = extrasFor(
      takeoffs.map((t) => spaceForQuote('', t)),
      settings.extraRules,
    );
    const codes = new Set([...needs.map((n) => n.kind as string), ...(actual?.extras ?? []).map((x) => x.code as string)]);
    let extraMinutes = 0;
    const extras = [...codes].map((code) => {
      const item = catalogue.extras.find((e) => e.kind === code && e.active) ?? catalogue.extras.find((e) => e.kind === code);
      const line = lines.find((x) => x.kind === 'extra' && x.extraKind === code);
      const estimated = line ? Number(line.quantity) : (needs.find((n) => n.kind === code)?.quantity ?? 0);
      extraMinutes += estimated * (item?.minutesPerUnit ?? 0);
      const used = actual?.extras.find((x) => x.code === code)?.used;
      return {
        code,
        label: item?.name ?? code.replace(/_/g, ' '),
        estimated,
        used: used ?? null,
        unitCostMinor: line?.unitCostMinor ?? item?.unitCostMinor ?? 0,
      };
    });
    const labourLines = lines.filter((x) => x.kind === 'labour');
    const estimatedHours = labourLines.length
      ? labourLines.reduce((a, x) => a + Number(x.quantity), 0)
      : areaM2.base / lab.baseM2PerHour + areaM2.cross / lab.crossM2PerHour + extraMinutes / 60;
    const estimatorId = biggest.authorId ?? job.createdById ?? null;
    out.push({
      jobId: job.id,
      reference: job.reference,
      finishedAt: completion.completedAt.toISOString(),
      estimator: estimatorId ? { id: estimatorId, name: users.get(estimatorId) ?? 'former user' } : null,
      loftShape: loftShapeOf(biggest.corners),
      wasteAllowancePct: takeoffs[0]?.wasteAllowancePct ?? settings.wasteAllowance * 100,
      rollCountMethod: settings.rollCountMethod,
      products: [...products.values()],
      extras,
      areaM2,
      estimatedHours: Math.round(estimatedHours * 1000) / 1000,
      extraHours: Math.round((extraMinutes / 60) * 1000) / 1000,
      hours: (actual?.hours ?? []).map((h) => ({ userId: h.userId, name: users.get(h.userId) ?? 'former user', hours: h.hours })),
      hourlyCostMinor: labourLines[0]?.unitCostMinor ?? lab.hourlyCostMinor,
      priceMinor: quote ? lines.reduce((a, x) => a + multiplyMinor(Number(x.quantity), x.unitPriceMinor), 0) : null,
    });
  }
  return out.sort((a, b) => a.finishedAt.localeCompare(b.finishedAt) || a.reference.localeCompare(b.reference));
}
