import { useFieldHome } from '../../../features/field/api/get-field-home';
import { useMe } from '../../../features/auth/api/get-me';
import { Card, CautionBox, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';

/** The crew's field sheet: this week's assigned work, who to call, and the safety rules. */
export function FieldHomePage() {
  const me = useMe();
  const home = useFieldHome();
  if (home.isPending) return <Loading />;
  if (home.isError) return <ErrorPanel error={home.error} />;
  const today = new Date().toLocaleDateString('en-US', { weekday: 'long', month: 'long', day: 'numeric' });
  return (
    <div className="flex flex-col gap-4">
      <div>
        <p className="text-sm text-slate">{today}</p>
        <h1 className="text-2xl font-bold">Field sheet</h1>
        <p className="text-slate">{me.data?.name} · {home.data.firm.name}</p>
      </div>
      <Card title="This week">
        <EmptyState title="No tasks assigned to you">When your consultant assigns work from the schedule, it shows here with the map, the rates to apply and a “Mark done” button.</EmptyState>
      </Card>
      <Card title="Who to call">
        <ul className="flex flex-col gap-3">
          {home.data.contacts.map((c) => (
            <li key={c.email} className="flex items-center justify-between gap-3">
              <span>
                <span className="block font-semibold">{c.name}</span>
                <span className="block text-xs capitalize text-slate">{c.role}</span>
              </span>
              {c.phone ? (
                <a className="rounded border border-moss px-3 py-2 text-sm font-semibold text-moss-deep" href={`tel:${c.phone.replace(/[^0-9+]/g, '')}`}>
                  Call {c.phone}
                </a>
              ) : (
                <a className="text-sm text-moss-deep underline" href={`mailto:${c.email}`}>{c.email}</a>
              )}
            </li>
          ))}
        </ul>
      </Card>
      <CautionBox title="Before you start any job">
        <ul className="list-disc pl-5">
          <li>Herbicides: the product label is the law. Restricted-use products need a certified applicator. Mind drift, water setbacks and protective equipment.</li>
          <li>Chainsaw and hinge-cutting work: chaps, eye, ear and head protection; never cut alone.</li>
          <li>Tree stands: wear a full-body harness and stay connected from the ground up.</li>
          <li>Follow local codes, state wildlife rules and licensed practice; ask your consultant when unsure.</li>
        </ul>
      </CautionBox>
    </div>
  );
}
