import { DataList } from '@chakra-ui/react';
import type { Call } from '../api';
import { KIND_LABELS } from '../labels';

const number = new Intl.NumberFormat(undefined, { maximumFractionDigits: 1 });

/** The rules a proposal in this call must follow, and how it will be reviewed. */
export function CallRules({ call }: { call: Call }) {
  const items: [string, string][] = [
    ['Proposal kinds accepted', call.proposalKinds.map((k) => KIND_LABELS[k]).join(', ')],
    ['Largest request per proposal', `${number.format(call.maxHoursPerProposal)} h`],
    [
      'Science case',
      `PDF, at most ${call.scienceCasePageLimit} ${call.scienceCasePageLimit === 1 ? 'page' : 'pages'} and ${number.format(call.scienceCaseMaxMb)} MB`,
    ],
    [
      'Review',
      call.anonymousReview
        ? 'Anonymous: referees do not see the team; keep names out of the science case'
        : 'Referees see the team',
    ],
    ['Referees per proposal', String(call.refereesPerProposal)],
    [
      'Score scale',
      `${call.scoreMin} to ${call.scoreMax}, ${call.scoreHigherIsBetter ? 'higher' : 'lower'} is better`,
    ],
  ];
  return (
    <DataList.Root orientation="horizontal" size="md">
      {items.map(([label, value]) => (
        <DataList.Item key={label}>
          <DataList.ItemLabel minW="14rem">{label}</DataList.ItemLabel>
          <DataList.ItemValue>{value}</DataList.ItemValue>
        </DataList.Item>
      ))}
    </DataList.Root>
  );
}
