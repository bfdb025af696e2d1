import { CAUTIONS, STANDARD_LABELS, STANDARDS } from '@shared/api';
import { usePageTitle } from '../lib/page-title';
import { PageHeader, Panel } from '../ui';

export function AboutPage() {
  usePageTitle('Scope and cautions');
  return (
    <>
      <PageHeader
        eyebrow="About Gaugeline"
        title="Scope and cautions"
        description="What Gaugeline checks, what it leaves to you, and the cautions that come with every result."
      />
      <div className="flex max-w-prose flex-col gap-block">
        <Panel title="What Gaugeline checks">
          <div className="flex flex-col gap-3">
            <p>
              Gaugeline reads an IFC building model, finds the steel members that carry tension and the bolted connections at their ends,
              and checks each member&rsquo;s tension capacity to the design standard chosen for the project:
            </p>
            <ul className="list-disc pl-6">
              {STANDARDS.map((id) => (
                <li key={id}>{STANDARD_LABELS[id]}</li>
              ))}
            </ul>
            <p>
              For each member it checks axial tension of the member itself and makes a simplified check of its bolted ends. Results are
              shown as the ratio of design action to design capacity, so engineers and project architects can see at a glance which
              members have capacity to spare and which need attention.
            </p>
            <p>Every value taken from the model, and every value assumed where the model says nothing, is listed so it can be reviewed.</p>
          </div>
        </Panel>
        <Panel title="Cautions">
          <ol className="flex list-decimal flex-col gap-2 pl-6">
            {CAUTIONS.map((caution) => (
              <li key={caution}>{caution}</li>
            ))}
          </ol>
        </Panel>
      </div>
    </>
  );
}
