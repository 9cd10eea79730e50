import type { QuoteDetail } from '@/db/queries/quotes';
import { formatMoney } from '@/server/money-format';

/** The quoted option's price, line by line. */
export function PriceTable({ quote }: { quote: Pick<QuoteDetail, 'hardwarePrice' | 'labourPrice' | 'extrasPrice' | 'extrasLabel' | 'discountAmount' | 'taxRatePercent' | 'subtotal' | 'taxAmount' | 'total' | 'currency' | 'chosenOption'> }) {
  const c = quote.currency;
  const rows: [string, string][] = [
    [`Hardware: ${quote.chosenOption.dishName}`, formatMoney(quote.hardwarePrice, c)],
    ['Installation labour', formatMoney(quote.labourPrice, c)],
  ];
  if (Number(quote.extrasPrice) > 0) rows.push([quote.extrasLabel ?? 'Extras', formatMoney(quote.extrasPrice, c)]);
  if (Number(quote.discountAmount) > 0) rows.push(['Discount', `−${formatMoney(quote.discountAmount, c)}`]);
  rows.push(['Subtotal', formatMoney(quote.subtotal, c)]);
  rows.push([`Tax (${Number(quote.taxRatePercent)} %)`, formatMoney(quote.taxAmount, c)]);
  return (
    <table className="w-full max-w-md text-sm">
      <caption className="sr-only">Price of the quoted option</caption>
      <tbody className="divide-y divide-stone-200">
        {rows.map(([label, value]) => (
          <tr key={label}>
            <th scope="row" className="py-1.5 pr-4 text-left font-normal text-stone-700">{label}</th>
            <td className="num py-1.5">{value}</td>
          </tr>
        ))}
        <tr className="border-t-2 border-stone-300">
          <th scope="row" className="py-2 pr-4 text-left font-semibold text-stone-900">Total</th>
          <td className="num py-2 text-base font-semibold text-stone-900">{formatMoney(quote.total, c)}</td>
        </tr>
      </tbody>
    </table>
  );
}
