import { Table, Td, Th, THead } from '../../../components/ui/table';
import type { Impact } from '../api/types';
import { Money, Pct, TargetMark } from './figures';

/** Add-ons and swaps whose extra cost moves: the upcharge set, and one that keeps the target. */
export function ModifiersTable({ impact }: { impact: Impact }) {
  const { currency } = impact;
  return (
    <Table caption="Add-ons and swaps affected">
      <THead>
        <tr>
          <Th>Add-on or swap</Th>
          <Th figure>Extra cost before</Th>
          <Th figure>Extra cost after</Th>
          <Th figure>Upcharge</Th>
          <Th figure>Margin before</Th>
          <Th figure>Margin after</Th>
          <Th>Target</Th>
          <Th figure>Suggested upcharge</Th>
        </tr>
      </THead>
      <tbody>
        {impact.modifiers.map((m) => (
          <tr key={`${m.modifierId}|${m.sizeId}`}>
            <Td>
              <div className="font-medium">{m.modifierName} <span className="font-normal">· {m.size}</span></div>
              <div className="text-xs text-muted">{m.ingredients.join(', ')}</div>
            </Td>
            <Td figure><Money value={m.oldCostDelta} currency={currency} detail /></Td>
            <Td figure><Money value={m.newCostDelta} currency={currency} detail /></Td>
            <Td figure><Money value={m.upcharge} currency={currency} /></Td>
            <Td figure><Pct value={m.oldMarginPct} /></Td>
            <Td figure><Pct value={m.newMarginPct} /></Td>
            <Td><TargetMark below={m.belowTarget} hasPrice={m.upcharge !== null} /></Td>
            <Td figure><Money value={m.suggestedUpcharge} currency={currency} /></Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
