import { useMemo, useState } from 'react';
import { Button, ButtonLink } from '../../components/ui/button';
import { CardSection } from '../../components/ui/card';
import { ConfirmDialog } from '../../components/ui/confirm-dialog';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { useToast } from '../../components/ui/toast';
import { isApiError } from '../../lib/api-client';
import { formatDate, formatMoney } from '../../lib/format';
import { paths } from '../../lib/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useRepricingIngredients } from '../../features/repricing/api/get-ingredients';
import { usePlannedPrices } from '../../features/repricing/api/pack-prices';
import { usePreviewImpact, type PreviewRequest } from '../../features/repricing/api/preview-impact';
import { useDeleteScenario, useSaveScenario } from '../../features/repricing/api/scenarios';
import type { Decision, PriceChange, Scenario } from '../../features/repricing/api/types';
import { ApplyPanel } from '../../features/repricing/components/apply-panel';
import { ChangesEditor } from '../../features/repricing/components/changes-editor';
import { CompareTable } from '../../features/repricing/components/compare-table';
import { ImpactTable } from '../../features/repricing/components/impact-table';
import { ImpactTotals } from '../../features/repricing/components/impact-totals';
import { ModifiersTable } from '../../features/repricing/components/modifiers-table';
import { PackPriceChart } from '../../features/repricing/components/pack-price-chart';
import { ScenariosPanel } from '../../features/repricing/components/scenarios-panel';
import { ScheduledPrices } from '../../features/repricing/components/scheduled-prices';

const todayUtc = () => new Date().toISOString().slice(0, 10);

export function RepricingRoute() {
  const me = useMe();
  const canApply = me.data?.user.role === 'owner' || me.data?.user.role === 'manager';
  const currency = me.data?.business.currency ?? 'GBP';
  const today = todayUtc();
  const ingredients = useRepricingIngredients();
  const planned = usePlannedPrices();
  const toast = useToast();

  const [base, setBase] = useState<{ changes: PriceChange[]; asOf?: string } | null>(null);
  const [decisions, setDecisions] = useState<Map<string, Decision>>(new Map());
  const [keepLadder, setKeepLadder] = useState(false);
  const [scenario, setScenario] = useState<Scenario | null>(null);
  const [compareIds, setCompareIds] = useState<string[]>([]);
  const [chartPack, setChartPack] = useState<string | null>(null);
  const [removing, setRemoving] = useState<Scenario | null>(null);

  const request: PreviewRequest | null = useMemo(
    () => (base ? { changes: base.changes, asOf: base.asOf, decisions: [...decisions.values()], keepLadder } : null),
    [base, decisions, keepLadder],
  );
  const impact = usePreviewImpact(request);
  const save = useSaveScenario();
  const del = useDeleteScenario();

  const decide = (d: Decision) => setDecisions((m) => new Map(m).set(d.drinkSizeId, d));
  const takeSuggestedBelowTarget = () =>
    setDecisions((m) => {
      const next = new Map(m);
      for (const r of impact.data?.rows ?? []) if (r.belowTarget && r.suggestedPrice) next.set(r.drinkSizeId, { drinkSizeId: r.drinkSizeId, choice: 'suggested' });
      return next;
    });
  const open = (s: Scenario) => {
    setScenario(s);
    setBase({ changes: s.changes, asOf: s.asOf ?? undefined });
    setDecisions(new Map(s.decisions.map((d) => [d.drinkSizeId, d])));
    setKeepLadder(s.keepLadder);
  };
  const chartFor = chartPack ?? impact.data?.changes.find((c) => c.packId)?.packId ?? null;
  const chartTitle = impact.data?.changes.find((c) => c.packId === chartFor)?.ingredientName ?? ingredients.data?.ingredients.find((i) => i.costingPack?.id === chartFor)?.name ?? '';
  const belowCount = impact.data?.rows.filter((r) => r.belowTarget && r.suggestedPrice).length ?? 0;

  return (
    <div className="flex flex-col gap-8">
      <PageHeader
        title="Repricing"
        description="See what a supplier's price change does to every drink and size, try what to do about it, then put the new prices on the menu."
        action={<ButtonLink to={paths.priceList.href()} variant="secondary">Price list</ButtonLink>}
      />

      <CardSection title="Proposed price changes">
        {ingredients.isPending ? (
          <SkeletonRows rows={2} label="Loading ingredients" />
        ) : ingredients.isError ? (
          <ErrorState error={ingredients.error} onRetry={() => ingredients.refetch()} />
        ) : ingredients.data.ingredients.length === 0 ? (
          <EmptyState title="No ingredients yet" next="Add ingredients with their packs and prices first; then try a price change here." action={<ButtonLink to={paths.ingredients.href()}>Add ingredients</ButtonLink>} />
        ) : (
          <ChangesEditor
            ingredients={ingredients.data.ingredients}
            currency={currency}
            initial={base ?? { changes: [] }}
            busy={impact.isFetching}
            onIngredientSeen={setChartPack}
            onSubmit={(v) => {
              setBase(v);
              setChartPack(null);
            }}
          />
        )}
        {planned.data && planned.data.planned.length > 0 && (
          <div className="mt-6 border-t border-rule pt-4">
            <h3 className="font-medium">Planned by suppliers</h3>
            <ul className="mt-2 flex flex-col gap-2 text-sm">
              {planned.data.planned.map((p) => (
                <li key={`${p.packId}|${p.effectiveFrom}`} className="flex flex-wrap items-center gap-3">
                  <span>
                    {p.ingredientName} ({p.packDescription}): {p.currentPrice ? formatMoney(p.currentPrice, currency) : 'no price'} → {formatMoney(p.price, currency)} from {formatDate(p.effectiveFrom)}
                    {!p.isCostingPack && ' (not the pack that sets the cost)'}
                  </span>
                  <Button size="sm" variant="secondary" onClick={() => setBase({ changes: base?.changes ?? [], asOf: p.effectiveFrom })}>
                    See the impact from {formatDate(p.effectiveFrom)}
                  </Button>
                </li>
              ))}
            </ul>
          </div>
        )}
      </CardSection>

      {chartFor && (
        <CardSection title="Pack price over time">
          <PackPriceChart packId={chartFor} title={chartTitle} currency={currency} today={today} />
        </CardSection>
      )}

      {request && (
        <section aria-labelledby="impact-heading" className="flex flex-col gap-4">
          <div className="flex flex-wrap items-end justify-between gap-4">
            <div>
              <h2 id="impact-heading" className="text-xl font-bold">
                Impact on the menu{scenario ? `: ${scenario.name}` : ''}
              </h2>
              {impact.data && (
                <p className="text-sm text-muted">
                  {impact.data.changes.map((c) => `${c.ingredientName} ${c.oldPrice ? formatMoney(c.oldPrice, currency) : '—'} → ${c.newPrice ? formatMoney(c.newPrice, currency) : '—'}${c.changePct ? ` (${c.changePct} %)` : ''}`).join('; ')}
                  {impact.data.pricesAsOf !== impact.data.asOf ? ` · with prices in force on ${formatDate(impact.data.pricesAsOf)}` : ''}. Nothing changes on the menu until you apply.
                </p>
              )}
            </div>
            {canApply && impact.data && (
              <div className="flex flex-wrap items-center gap-4">
                <label className="flex items-center gap-2 text-sm">
                  <input type="checkbox" className="h-4 w-4 accent-copper" checked={keepLadder} onChange={(e) => setKeepLadder(e.target.checked)} />
                  Keep a tidy ladder across sizes (every size moves by the same amount)
                </label>
                <Button variant="secondary" onClick={takeSuggestedBelowTarget} disabled={belowCount === 0}>
                  Take suggested prices for the {belowCount} below target
                </Button>
              </div>
            )}
          </div>
          {impact.isPending ? (
            <SkeletonRows rows={6} label="Working out the impact" />
          ) : impact.isError ? (
            <ErrorState error={impact.error} onRetry={() => impact.refetch()} />
          ) : impact.data.rows.length === 0 && impact.data.modifiers.length === 0 ? (
            <EmptyState title="No drink uses these ingredients" next="Nothing on the menu changes cost. Try another ingredient, or check the drinks' builds." />
          ) : (
            <>
              <ImpactTotals impact={impact.data} />
              {impact.data.rows.length > 0 && <ImpactTable impact={impact.data} decisions={decisions} onDecide={decide} readOnly={!canApply} />}
              {impact.data.modifiers.length > 0 && (
                <>
                  <h3 className="text-lg font-bold">Add-ons and swaps</h3>
                  <ModifiersTable impact={impact.data} />
                </>
              )}
              {canApply && (
                <CardSection title="Apply the new prices">
                  <ApplyPanel
                    impact={impact.data}
                    scenarioId={scenario?.id ?? null}
                    keepLadder={keepLadder}
                    today={today}
                    onApplied={() => {
                      setDecisions(new Map());
                      setScenario(null);
                    }}
                  />
                </CardSection>
              )}
            </>
          )}
        </section>
      )}

      <CardSection title="Scheduled menu prices">
        <ScheduledPrices canCancel={canApply} />
      </CardSection>

      <CardSection title="Scenarios">
        <ScenariosPanel
          canSave={canApply && request !== null}
          openId={scenario?.id ?? null}
          saving={save.isPending}
          saveError={save.error ? (isApiError(save.error) ? save.error.message : 'Could not save the scenario.') : null}
          onSave={(name) =>
            request &&
            save.mutate(
              { body: { name, changes: request.changes, asOf: request.asOf ?? null, decisions: request.decisions ?? [], keepLadder } },
              {
                onSuccess: (r) => {
                  setScenario(r.scenario);
                  toast.notify(`Saved the draft "${r.scenario.name}".`);
                },
              },
            )
          }
          onOpen={open}
          onCompare={setCompareIds}
          onDelete={setRemoving}
        />
        {compareIds.length >= 2 && (
          <div className="mt-6">
            <CompareTable ids={compareIds} />
          </div>
        )}
      </CardSection>

      <ConfirmDialog
        open={removing !== null}
        title={`Remove the draft "${removing?.name ?? ''}"?`}
        consequence="Its proposed changes and price choices are lost. The menu is not affected."
        confirmLabel="Remove the draft"
        busy={del.isPending}
        onConfirm={() =>
          removing &&
          del.mutate(removing.id, {
            onSuccess: () => {
              if (scenario?.id === removing.id) setScenario(null);
              setRemoving(null);
            },
          })
        }
        onCancel={() => setRemoving(null)}
      />
    </div>
  );
}
