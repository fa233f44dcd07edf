import { Tab, TabGroup, TabList, TabPanel, TabPanels } from '@headlessui/react';
import { useSearchParams } from 'react-router-dom';
import { calculations, type CalculationId } from '../calculations';
import { PlaygroundSceneProvider, VisibleCalculationContext } from './playground-scene';
import { SiteConditions } from './site-conditions';
import { BacklightPanel } from './backlight/backlight-panel';
import { BalancePanel } from './balance/balance-panel';
import { ExposurePanel } from './exposure/exposure-panel';
import { FalloffPanel } from './falloff/falloff-panel';
import { FlashPanel } from './flash/flash-panel';
import { SetupPanel } from './setup/setup-panel';
import { TimelinePanel } from './timeline/timeline-panel';
import { TwilightPanel } from './twilight/twilight-panel';
import { UnitToggle } from './unit-toggle';

const panels: Partial<Record<CalculationId, () => React.ReactNode>> = {
  twilight: () => <TwilightPanel />,
  timeline: () => <TimelinePanel />,
  exposure: () => <ExposurePanel />,
  flash: () => <FlashPanel />,
  falloff: () => <FalloffPanel />,
  backlight: () => <BacklightPanel />,
  balance: () => <BalancePanel />,
  setup: () => <SetupPanel />,
};

const available = calculations.filter((calculation) => panels[calculation.id]);

/** All calculations as tabs (kept mounted so inputs survive switching); `?calc=` picks one. */
export function Playground() {
  const [params, setParams] = useSearchParams();
  const selected = Math.max(
    0,
    available.findIndex((calculation) => calculation.id === params.get('calc')),
  );
  const select = (index: number) => {
    const next = new URLSearchParams(params);
    next.set('calc', available[index]?.id ?? 'twilight');
    setParams(next, { replace: true });
  };

  return (
    <PlaygroundSceneProvider>
      <VisibleCalculationContext.Provider value={available[selected]?.id ?? null}>
        <div className="mb-4 flex flex-wrap items-center justify-between gap-3 print:hidden">
          <UnitToggle />
        </div>
        <div className="mb-4">
          <SiteConditions />
        </div>
        <TabGroup selectedIndex={selected} onChange={select}>
          <TabList
            aria-label="Calculations"
            className="mb-4 flex flex-wrap gap-1 border-b border-edge pb-px"
          >
            {available.map((calculation) => (
              <Tab
                key={calculation.id}
                className="shrink-0 rounded-t-control border-b-2 border-transparent px-3 py-2 text-body font-medium whitespace-nowrap text-ink-muted data-hover:text-ink data-selected:border-accent data-selected:text-ink data-focus:outline-2 data-focus:outline-focus"
              >
                {calculation.label}
              </Tab>
            ))}
          </TabList>
          <TabPanels>
            {available.map((calculation) => (
              // tabIndex -1: the panel holds form fields, so Tab goes from the tab straight to the
              // first field instead of stopping on the panel itself (Headless UI's default is 0).
              <TabPanel key={calculation.id} unmount={false} tabIndex={-1} className="rounded-card">
                {panels[calculation.id]?.()}
              </TabPanel>
            ))}
          </TabPanels>
        </TabGroup>
      </VisibleCalculationContext.Provider>
    </PlaygroundSceneProvider>
  );
}
