import { EmptyState } from '../../../components/ui/empty-state';
import { StatusMark } from '../../../components/ui/status-mark';
import { Table, Td, Th, THead } from '../../../components/ui/table';
import { formatDate, formatMoney } from '../../../lib/format';
import type { PriceHistory } from '../api/get-price-history';

/** Every menu price change of one drink: when, which size, old → new, why and who; planned and cancelled ones marked. */
export function PriceHistoryTable({ data }: { data: PriceHistory }) {
  if (data.history.length === 0) return <EmptyState title="No price changes yet" next="Prices set in the drink editor or applied from repricing show here." />;
  const c = data.currency;
  return (
    <Table caption={`Price history of ${data.drink.name}`}>
      <THead>
        <tr>
          <Th>Takes effect</Th>
          <Th>Size</Th>
          <Th figure>Old price</Th>
          <Th figure>New price</Th>
          <Th>Why</Th>
          <Th>Who</Th>
          <Th>Changed</Th>
        </tr>
      </THead>
      <tbody>
        {data.history.map((h) => (
          <tr key={h.id}>
            <Td>
              {formatDate(h.effectiveFrom)}
              {h.status === 'planned' && (
                <>
                  {' '}
                  <StatusMark tone="info">Planned</StatusMark>
                </>
              )}
              {h.status === 'cancelled' && (
                <>
                  {' '}
                  <StatusMark tone="neutral">Cancelled</StatusMark>
                </>
              )}
            </Td>
            <Td>{h.size}</Td>
            <Td figure>{h.oldPrice ? formatMoney(h.oldPrice, c) : '—'}</Td>
            <Td figure>{formatMoney(h.newPrice, c)}</Td>
            <Td>{h.scenarioName ? `Scenario: ${h.scenarioName}` : (h.reason ?? '—')}</Td>
            <Td>{h.changedBy?.name ?? '—'}</Td>
            <Td>{formatDate(h.changedAt, { withTime: true })}</Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
