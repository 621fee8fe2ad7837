import { Card, Heading, NativeSelect, Stack, Text } from '@chakra-ui/react';
import { type ReactNode, useState } from 'react';
import { FormField } from '@/components/ui/form-field';
import { PageLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { toaster } from '@/components/ui/toaster';
import { defineRoute } from '@/lib/route-module';
import { type Observatory, observatoriesQueryOptions } from '../api';
import { BandsTable } from '../components/bands-table';
import { ConfigurationsTable } from '../components/configurations-table';
import { SiteForm } from '../components/site-form';
import { useCreateObservatory, useObservatories, useUpdateObservatory } from '../hooks';

function Section({
  id,
  title,
  description,
  children,
}: {
  id: string;
  title: string;
  description: string;
  children: ReactNode;
}) {
  return (
    <Card.Root as="section" aria-labelledby={id} variant="outline">
      <Card.Body>
        <Stack gap="4">
          <Stack gap="1">
            <Heading as="h2" size="lg" id={id}>
              {title}
            </Heading>
            <Text color="fg.muted" fontSize="sm">
              {description}
            </Text>
          </Stack>
          {children}
        </Stack>
      </Card.Body>
    </Card.Root>
  );
}

function ArrayEditor({ observatory }: { observatory: Observatory }) {
  const update = useUpdateObservatory(observatory.id);
  return (
    <Stack gap="6">
      <Section
        id="site-heading"
        title="Site and instrument"
        description="Where the array stands and what every antenna shares. The calculator uses these numbers."
      >
        <SiteForm
          observatory={observatory}
          pending={update.isPending}
          onSave={async (input) => {
            await update.mutateAsync(input);
            toaster.create({ type: 'success', title: 'Site saved' });
          }}
        />
      </Section>
      <Section
        id="configurations-heading"
        title="Configurations"
        description="Layouts of the antennas; a call offers its hours per configuration."
      >
        <ConfigurationsTable
          observatoryId={observatory.id}
          configurations={observatory.configurations}
        />
      </Section>
      <Section
        id="bands-heading"
        title="Receiver bands"
        description="What the receivers cover, with their system temperature and efficiency."
      >
        <BandsTable observatoryId={observatory.id} bands={observatory.bands} />
      </Section>
    </Stack>
  );
}

function NewArray() {
  const create = useCreateObservatory();
  return (
    <Section
      id="site-heading"
      title="Describe the array"
      description="No array is set up yet. Start with its site and instrument; add configurations and bands after."
    >
      <SiteForm
        pending={create.isPending}
        onSave={async (input) => {
          await create.mutateAsync(input);
          toaster.create({ type: 'success', title: `${input.name} created` });
        }}
      />
    </Section>
  );
}

function ArraySetupPage() {
  const query = useObservatories();
  const [chosen, setChosen] = useState<string | null>(null);
  if (query.isPending) return <PageLoader />;
  // The loader fetched the list; an error there shows the route's error screen.
  const observatories = query.data ?? [];
  const observatory = observatories.find((o) => o.id === chosen) ?? observatories[0];
  return (
    <>
      <PageHeader
        title="Array setup"
        description="The observatory's site, its configurations and its receiver bands."
      />
      {observatories.length > 1 && (
        <FormField label="Array" maxW="sm" mb="6">
          <NativeSelect.Root>
            <NativeSelect.Field value={observatory?.id} onChange={(e) => setChosen(e.target.value)}>
              {observatories.map((o) => (
                <option key={o.id} value={o.id}>
                  {o.name}
                </option>
              ))}
            </NativeSelect.Field>
            <NativeSelect.Indicator />
          </NativeSelect.Root>
        </FormField>
      )}
      {observatory ? <ArrayEditor key={observatory.id} observatory={observatory} /> : <NewArray />}
    </>
  );
}

export const route = defineRoute({
  Component: ArraySetupPage,
  loader: (queryClient) => async () => {
    await queryClient.ensureQueryData(observatoriesQueryOptions());
    return null;
  },
});
