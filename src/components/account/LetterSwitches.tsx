/**
 * The account page's "Monthly letter" switches, one per household (React island): each member
 * turns their own letter on or off with PATCH /api/households/{id}/letter. The switch shows the
 * stored value and waits for the server before it moves; a refusal is shown beside it.
 */
import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { QueryProvider } from '@/components/QueryProvider';
import { request } from '@/components/request';
import type { LetterSetting } from '@/lib/letter-schemas';

export interface LetterHousehold {
  id: number;
  name: string;
  role: string;
  monthlyLetter: boolean;
}

function LetterSwitch({ household }: { household: LetterHousehold }) {
  const [on, setOn] = useState(household.monthlyLetter);
  const save = useMutation({
    mutationFn: (body: LetterSetting) => request<LetterSetting>('PATCH', `/api/households/${household.id}/letter`, body),
    onSuccess: (answer) => setOn(answer.monthlyLetter),
  });
  const labelId = `letter-${household.id}`;
  return (
    <li className="flex flex-wrap items-center gap-3 border-t border-loam-200 py-3 first:border-t-0" data-testid={`letter-row-${household.id}`}>
      <div className="min-w-0 flex-1">
        <a href={`/households/${household.id}`} className="font-bold text-sprout-900 underline-offset-2 hover:underline">
          {household.name}
        </a>
        <span className="block text-sm text-loam-700">You are {household.role}</span>
      </div>
      <div className="flex items-center gap-3">
        <span id={labelId} className="text-sm">
          Monthly letter: <span className="font-semibold">{on ? 'on' : 'off'}</span>
        </span>
        <button
          type="button"
          role="switch"
          aria-checked={on}
          aria-labelledby={labelId}
          disabled={save.isPending}
          onClick={() => save.mutate({ monthlyLetter: !on })}
          data-testid={`letter-switch-${household.id}`}
          className={`relative inline-flex h-10 w-16 shrink-0 items-center rounded-full border-2 transition-colors ${on ? 'border-sprout-700 bg-sprout-700' : 'border-loam-500 bg-loam-100'}`}
        >
          <span className={`inline-block h-7 w-7 rounded-full bg-white shadow transition-transform ${on ? 'translate-x-7' : 'translate-x-1'}`} />
        </button>
      </div>
      {save.isError && (
        <p role="alert" className="w-full text-sm font-semibold text-berry-700">
          {save.error instanceof Error ? save.error.message : 'The change was not saved.'}
        </p>
      )}
    </li>
  );
}

export function LetterSwitches({ households }: { households: LetterHousehold[] }) {
  return (
    <QueryProvider>
      <ul className="mt-2" data-testid="letter-switches">
        {households.map((h) => (
          <LetterSwitch key={h.id} household={h} />
        ))}
      </ul>
    </QueryProvider>
  );
}
