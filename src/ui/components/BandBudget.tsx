import { budgetLine, type BudgetEntry } from '../../chemistry';

/**
 * Where the calcite SI band comes from: each source's share of it and what would narrow it.
 * Shown inside the opened Calcite SI row (issue 12: the crew sees what to redo at the bank).
 */
export function BandBudget({ band, budget }: { band: number; budget: BudgetEntry[] }) {
  const shown = budget.filter((e) => e.share >= 0.01);
  return (
    <div class="band-budget" data-testid="band-budget">
      <p>The band ± {band.toFixed(2)} holds the true SI about 95 times in 100 (expanded uncertainty, k = 2). It comes from:</p>
      <ul>
        {shown.map((e) => (
          <li key={e.source} data-source={e.source}>
            <span class="budget-bar" style={{ width: `${Math.max(4, Math.round(e.share * 100))}%` }} aria-hidden="true" />
            {budgetLine(e)}
          </li>
        ))}
      </ul>
    </div>
  );
}
