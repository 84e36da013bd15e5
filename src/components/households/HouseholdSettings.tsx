/**
 * The settings page's island (owner only): the household's details, the month its records start
 * and the danger zone, in one root so a rename shows at once in the page header and in the
 * deletion's typed confirmation.
 */
import { useState } from 'react';
import { QueryProvider } from '@/components/QueryProvider';
import { DatasetOrderForm } from './DatasetOrderForm';
import { DeleteHousehold } from './DeleteHousehold';
import { HouseholdDetailsForm, type HouseholdSettingsJson } from './HouseholdDetailsForm';
import { RecordsSinceForm } from './RecordsSinceForm';

/** The server-rendered header and tab title show the name too: keep them in step after a rename. */
function showNameInPage(name: string, previous: string): void {
  document.querySelectorAll('[data-testid="household-name"]').forEach((el) => {
    el.textContent = name;
  });
  document.title = document.title.replace(previous, name);
}

export function HouseholdSettings({ household, zones, recordsFrom }: { household: HouseholdSettingsJson; zones: string[]; recordsFrom: string }) {
  const [current, setCurrent] = useState(household);
  return (
    <QueryProvider>
      <HouseholdDetailsForm
        household={household}
        zones={zones}
        onSaved={(h) => {
          showNameInPage(h.name, current.name);
          setCurrent(h);
        }}
      />
      <RecordsSinceForm householdId={household.id} current={household.recordsSince} effective={recordsFrom} />
      <DatasetOrderForm householdId={household.id} />
      <DeleteHousehold householdId={household.id} name={current.name} />
    </QueryProvider>
  );
}
