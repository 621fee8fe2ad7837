import { Card, Heading, Link, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import {
  CalendarRange,
  ClipboardList,
  Megaphone,
  SatelliteDish,
  type LucideIcon,
} from 'lucide-react';
import { Link as RouterLink } from 'react-router-dom';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/lib/paths';
import { defineRoute } from '@/lib/route-module';

const AREAS: { to: string; title: string; description: string; icon: LucideIcon }[] = [
  {
    to: paths.operationsArray,
    title: 'Array setup',
    description: 'The site, the configurations and the receiver bands.',
    icon: SatelliteDish,
  },
  {
    to: paths.operationsCalls,
    title: 'Calls for proposals',
    description: 'Create calls, open them, move them along, appoint chairs and referees.',
    icon: Megaphone,
  },
  {
    to: paths.operationsAssessments,
    title: 'Technical assessments',
    description: 'Check each submitted proposal: feasible, feasible with changes or not feasible.',
    icon: ClipboardList,
  },
  {
    to: paths.operationsPlans,
    title: 'Observing plans',
    description: 'Turn a published call’s grants into runs, and record what was observed.',
    icon: CalendarRange,
  },
];

/** Staff's start into operations. */
function OperationsPage() {
  return (
    <>
      <PageHeader title="Operations" description="Running the observatory's side of Skyhours." />
      <SimpleGrid columns={{ base: 1, md: 2 }} gap="6">
        {AREAS.map(({ to, title, description, icon: IconComponent }) => (
          <Card.Root
            key={to}
            variant="outline"
            position="relative"
            _hover={{ borderColor: 'brand.solid' }}
          >
            <Card.Body>
              <Stack gap="2">
                <IconComponent aria-hidden size="1.5rem" />
                <Heading as="h2" size="lg">
                  <Link
                    asChild
                    color="fg"
                    _after={{ content: '""', position: 'absolute', inset: 0 }}
                  >
                    <RouterLink to={to}>{title}</RouterLink>
                  </Link>
                </Heading>
                <Text color="fg.muted">{description}</Text>
              </Stack>
            </Card.Body>
          </Card.Root>
        ))}
      </SimpleGrid>
    </>
  );
}

export const route = defineRoute({ Component: OperationsPage });
