import Link from 'next/link';

const STEPS = [
  { title: 'One site, one service', body: 'Enter the customer’s coordinates and the satellite service: orbital slot, downlink frequency, EIRP, symbol rate and MODCOD.' },
  { title: 'Every dish, side by side', body: 'For each dish in your catalogue: gain, G/T, clear-sky Es/N0, fade margin, availability, and outage minutes in an average year and in the worst month.' },
  { title: 'A quote they understand', body: 'Pick the option, add your prices, and send a link that explains each choice in plain words. The customer accepts with their name; your team sees it at once.' },
];

const METHODS = [
  ['ITU-R P.618-14', 'rain attenuation on the slant path, and its inverse: the share of the year a fade is exceeded'],
  ['ITU-R P.837-7', 'rain rate from monthly climate normals, or your measured exceedance curve'],
  ['ITU-R P.838-3', 'specific attenuation for the polarization and elevation of the path'],
  ['ITU-R P.839-4', 'rain height from the 0 °C isotherm'],
  ['ITU-R P.841', 'worst-month outage from the annual figure'],
  ['DVB-S2', 'required Es/N0 per MODCOD, and expected throughput on ACM carriers'],
];

export default function LandingPage() {
  return (
    <>
      <section className="mx-auto max-w-6xl px-6 pb-12 pt-16">
        <p className="font-mono text-sm text-ledger-700">For satellite installers and the sales desks of service resellers</p>
        <h1 className="mt-3 max-w-3xl text-4xl font-semibold tracking-tight text-stone-900">
          How many minutes a year will rain take from this customer — and what does the next dish size buy back?
        </h1>
        <p className="mt-5 max-w-2xl text-lg text-stone-600">
          FadeLedger computes the link budget and the rain-fade outage of every candidate dish for one site and one
          satellite service, recommends the smallest dish that meets the availability you promise, and turns it into a
          quote your customer can read, share and accept.
        </p>
        <div className="mt-8 flex gap-3">
          <Link href="/sign-up" className="rounded bg-ledger-700 px-4 py-2 font-medium text-white hover:bg-ledger-800">Start a 14-day trial</Link>
          <Link href="/sign-in" className="rounded border border-stone-300 bg-white px-4 py-2 font-medium text-stone-800 hover:border-ledger-600">Sign in</Link>
        </div>
      </section>

      <section className="border-y border-stone-200 bg-white">
        <div className="mx-auto grid max-w-6xl gap-8 px-6 py-12 md:grid-cols-3">
          {STEPS.map((s, i) => (
            <div key={s.title}>
              <p className="font-mono text-sm text-ledger-700">{String(i + 1).padStart(2, '0')}</p>
              <h2 className="mt-1 text-lg font-semibold">{s.title}</h2>
              <p className="mt-2 text-stone-600">{s.body}</p>
            </div>
          ))}
        </div>
      </section>

      <section className="mx-auto max-w-6xl px-6 py-12">
        <h2 className="text-lg font-semibold">Published methods, checked against published figures</h2>
        <table className="mt-4 w-full max-w-3xl text-sm">
          <tbody>
            {METHODS.map(([name, what]) => (
              <tr key={name} className="border-b border-stone-200">
                <th scope="row" className="py-2 pr-6 text-left font-mono font-medium text-stone-800">{name}</th>
                <td className="py-2 text-stone-600">{what}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-6 max-w-3xl text-sm text-stone-500">
          Outage figures are long-term averages, not a promise for any one year; where local measured rain data exists,
          it beats a global model, and FadeLedger lets you use it.
        </p>
      </section>
    </>
  );
}
