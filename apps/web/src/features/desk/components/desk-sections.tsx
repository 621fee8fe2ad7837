import { Badge, Box, Card, Heading, Link, Progress, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { formatCountdown, formatLocalAndUtc } from '@/lib/time';
import { type Desk, type DeskLink, deskHref } from '../api';

const words = (s: string) => s.replaceAll('_', ' ');
const TIERS: Record<string, string> = {
  tier1: 'Tier 1',
  tier2: 'Tier 2',
  tier3: 'Tier 3',
  not_allocated: 'Not allocated',
};
const hours = (h: number) => `${Math.round(h * 10) / 10} h`;

/** A deadline: the countdown first, then the moment in the viewer's zone and in UTC. */
export function Due({ at, now, label }: { at: string; now: Date; label: string }) {
  const { local, utc } = formatLocalAndUtc(at);
  const passed = new Date(at).getTime() < now.getTime();
  return (
    <Text fontSize="sm" color={passed ? 'fg.error' : 'fg.muted'}>
      {label} {formatCountdown(at, now)} · <time dateTime={at}>{local}</time> ({utc})
    </Text>
  );
}

function ItemLink({ link, children }: { link: DeskLink; children: ReactNode }) {
  return (
    <Link asChild fontWeight="medium" colorPalette="brand">
      <RouterLink to={deskHref(link)}>{children}</RouterLink>
    </Link>
  );
}

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <Card.Root as="section" aria-labelledby={`${id}-heading`} variant="outline">
      <Card.Body>
        <Stack gap="4">
          <Heading as="h2" size="md" id={`${id}-heading`}>
            {title}
          </Heading>
          {children}
        </Stack>
      </Card.Body>
    </Card.Root>
  );
}

function Group({
  title,
  empty,
  children,
}: {
  title: string;
  empty: string;
  children: ReactNode[];
}) {
  return (
    <Stack gap="2">
      <Heading as="h3" size="sm">
        {title}
      </Heading>
      {children.length === 0 ? (
        <Text color="fg.muted" fontSize="sm">
          {empty}
        </Text>
      ) : (
        <Stack as="ul" gap="3" listStyleType="none" ps="0">
          {children}
        </Stack>
      )}
    </Stack>
  );
}

export function ProposerSection({ desk, now }: { desk: NonNullable<Desk['proposer']>; now: Date }) {
  return (
    <Section id="desk-proposer" title="Your proposals">
      <Group title="Drafts" empty="No drafts. Start one from an open call.">
        {desk.drafts.map((d) => (
          <Box as="li" key={d.reference}>
            <ItemLink link={d.link}>
              {d.reference} · {d.title || 'Untitled'}
            </ItemLink>
            <Due at={d.deadlineAt} now={now} label={`${d.callCode} deadline`} />
            <Stack direction="row" gap="2" mt="1" wrap="wrap">
              <Badge colorPalette={d.blockers > 0 ? 'red' : 'green'}>
                {d.blockers === 0
                  ? 'No blockers'
                  : `${d.blockers} blocker${d.blockers === 1 ? '' : 's'}`}
              </Badge>
              {d.warnings > 0 && (
                <Badge colorPalette="orange">
                  {d.warnings} warning{d.warnings === 1 ? '' : 's'}
                </Badge>
              )}
            </Stack>
            {d.blockerMessages.length > 0 && (
              <Stack as="ul" gap="0.5" mt="1" ps="4" fontSize="sm">
                {d.blockerMessages.map((m) => (
                  <li key={m}>{m}</li>
                ))}
              </Stack>
            )}
          </Box>
        ))}
      </Group>
      <Group title="Open calls" empty="No call is open now.">
        {desk.openCalls.map((c) => (
          <Box as="li" key={c.code}>
            <ItemLink link={c.link}>
              {c.code} · {c.title}
            </ItemLink>
            <Due at={c.deadlineAt} now={now} label="Deadline" />
          </Box>
        ))}
      </Group>
      <Group title="Submitted and outcomes" empty="Nothing submitted yet.">
        {desk.submitted.map((s) => (
          <Box as="li" key={s.reference}>
            <ItemLink link={s.link}>
              {s.reference} · {s.title}
            </ItemLink>
            <Text fontSize="sm" color="fg.muted">
              {words(s.status)}
              {s.tier ? ` · ${TIERS[s.tier] ?? s.tier}` : ''}
            </Text>
          </Box>
        ))}
      </Group>
      {desk.progress.length > 0 && (
        <Group title="Progress of granted time" empty="">
          {desk.progress.map((p) => (
            <Box as="li" key={p.reference}>
              <ItemLink link={p.link}>
                {p.reference} · {p.title}
              </ItemLink>
              <Progress.Root
                value={Math.min(p.hoursObtained, p.hoursGranted)}
                max={p.hoursGranted}
                size="sm"
                mt="1"
                aria-label={`Hours obtained of ${p.reference}`}
              >
                <Progress.Track>
                  <Progress.Range />
                </Progress.Track>
              </Progress.Root>
              <Text fontSize="sm" color="fg.muted">
                {hours(p.hoursObtained)} obtained of {hours(p.hoursGranted)} granted
                {p.runsToCome > 0 ? ` · ${p.runsToCome} runs to come` : ''}
              </Text>
            </Box>
          ))}
        </Group>
      )}
    </Section>
  );
}

export function RefereeSection({ desk, now }: { desk: NonNullable<Desk['referee']>; now: Date }) {
  return (
    <Section id="desk-referee" title="Reviewing">
      {desk.calls.map((c) => (
        <Text key={c.code}>
          {c.code}: {c.done} of {c.total} reviews done
        </Text>
      ))}
      <Group title="Reviews to write" empty="No review waits for you.">
        {desk.toDo.map((a) => (
          <Box as="li" key={a.id}>
            <ItemLink link={a.link}>
              {a.reference} · {a.title}
            </ItemLink>
            <Due at={a.dueAt} now={now} label={`${words(a.status)} · due`} />
          </Box>
        ))}
      </Group>
    </Section>
  );
}

export function ChairSection({ desk, now }: { desk: NonNullable<Desk['chair']>; now: Date }) {
  return (
    <Section id="desk-chair" title="Your calls as chair">
      <Group title="Calls" empty="No call of yours is past its deadline yet.">
        {desk.calls.map((c) => (
          <Box as="li" key={c.code}>
            <ItemLink link={c.link}>
              {c.code} · {c.title}
            </ItemLink>
            <Text fontSize="sm">
              {words(c.status)} · {c.reviewsDone} of {c.reviewsExpected} reviews in · {c.undecided}{' '}
              of {c.proposals} proposals undecided
            </Text>
            <Due at={c.reviewDueAt} now={now} label="Reviews due" />
            <Stack as="ul" gap="0.5" mt="1" ps="4" fontSize="sm">
              {c.pressure.map((p) => (
                <li key={p.configuration}>
                  {p.configuration}: {hours(p.hoursAsked)} asked of {hours(p.hoursOffered)} offered
                  (<strong>{p.ratio.toFixed(1)}×</strong>
                  {p.ratio > 1 ? ', oversubscribed' : ''})
                </li>
              ))}
            </Stack>
          </Box>
        ))}
      </Group>
    </Section>
  );
}

export function StaffSection({ desk, now }: { desk: NonNullable<Desk['staff']>; now: Date }) {
  return (
    <Section id="desk-staff" title="Operations">
      <Group title="Technical assessments waiting" empty="Every proposal is assessed.">
        {desk.assessmentsWaiting.map((w) => (
          <Box as="li" key={w.callCode}>
            <ItemLink link={w.link}>
              {w.callCode}: {w.waiting} proposal{w.waiting === 1 ? '' : 's'} to assess
            </ItemLink>
          </Box>
        ))}
      </Group>
      <Group title="Plans" empty="No plan yet.">
        {desk.plans.map((p) => (
          <Box as="li" key={p.callCode}>
            <ItemLink link={p.link}>{p.callCode} plan</ItemLink>
            <Text fontSize="sm">
              {p.generatedAt ? '' : 'Not generated yet · '}
              {p.runsObserved} observed · {p.runsLost} lost · {p.runsPlanned} planned
              {p.runsToRecord > 0 ? ` · ${p.runsToRecord} to record` : ''}
            </Text>
          </Box>
        ))}
      </Group>
      <Group title="Calls" empty="No call yet.">
        {desk.calls.map((c) => (
          <Box as="li" key={c.code}>
            <ItemLink link={c.link}>
              {c.code} · {c.title}
            </ItemLink>
            <Text fontSize="sm" color="fg.muted">
              {words(c.status)}
            </Text>
            {c.status === 'open' && <Due at={c.deadlineAt} now={now} label="Deadline" />}
          </Box>
        ))}
      </Group>
    </Section>
  );
}

export function AdminSection({ desk }: { desk: NonNullable<Desk['admin']> }) {
  return (
    <Section id="desk-admin" title="Accounts">
      <Text>
        <ItemLink link={desk.link}>{desk.accounts} accounts</ItemLink>
        {desk.unverified > 0 ? ` · ${desk.unverified} not verified yet` : ''}
      </Text>
      <Group title="Recent changes" empty="Nothing recorded yet.">
        {desk.recentEvents.map((e, i) => (
          <Box as="li" key={`${e.at}-${i}`} fontSize="sm">
            <time dateTime={e.at}>{formatLocalAndUtc(e.at).local}</time> · {e.action}
            {e.actorName ? ` by ${e.actorName}` : ''}
          </Box>
        ))}
      </Group>
    </Section>
  );
}
