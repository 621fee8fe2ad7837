import { Button, HStack, Input, NativeSelect, Stack, Text, Textarea } from '@chakra-ui/react';
import { useForm } from 'react-hook-form';
import { FormError, FormField } from '@/components/ui/form-field';
import { toaster } from '@/components/ui/toaster';
import { setServerErrors } from '@/lib/form-errors';
import type { ReviewDetail } from '../api';
import { useSaveReview } from '../hooks';
import { EXPERTISE_LABELS } from '../labels';

interface ReviewFormValues {
  score: string;
  expertise: '' | '1' | '2' | '3';
  commentToPi: string;
  commentToCommittee: string;
}

const FIELDS = ['score', 'expertise', 'commentToPi', 'commentToCommittee'] as const;

const valuesOf = (r: ReviewDetail): ReviewFormValues => ({
  score: r.score === null ? '' : String(r.score),
  expertise: r.expertise === null ? '' : (String(r.expertise) as '1' | '2' | '3'),
  commentToPi: r.commentToPi,
  commentToCommittee: r.commentToCommittee,
});

/**
 * The review: score on the call's scale, a comment for the PI, one for the committee, and the
 * referee's own expertise. A draft may be incomplete; the server checks the same rules again.
 */
export function ReviewForm({ review }: { review: ReviewDetail }) {
  const save = useSaveReview(review.id);
  const { call } = review;
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isDirty },
  } = useForm<ReviewFormValues>({ values: valuesOf(review) });
  const readOnly = !review.editable;
  const submitted = review.status === 'submitted';

  const send = (submit: boolean) =>
    handleSubmit((v) =>
      save.mutate(
        {
          version: review.version,
          submit,
          score: v.score.trim() === '' ? null : Number(v.score),
          expertise: v.expertise === '' ? null : (Number(v.expertise) as 1 | 2 | 3),
          commentToPi: v.commentToPi,
          commentToCommittee: v.commentToCommittee,
        },
        {
          onSuccess: (saved) => {
            reset(valuesOf(saved));
            toaster.create({
              type: 'success',
              title: saved.status === 'submitted' ? 'Review submitted' : 'Draft saved',
            });
          },
          onError: (error) => setServerErrors(error, setError, FIELDS),
        },
      ),
    );

  return (
    <Stack asChild gap="5">
      <form onSubmit={send(true)} noValidate aria-label="Your review">
        <FormField
          label={`Score (${call.scoreMin}–${call.scoreMax})`}
          helperText={`${call.scoreHigherIsBetter ? 'Higher' : 'Lower'} is better on this call's scale.`}
          error={errors.score}
          required
        >
          <Input
            {...register('score')}
            inputMode="decimal"
            maxW="10rem"
            readOnly={readOnly}
            aria-describedby={undefined}
          />
        </FormField>
        <FormField label="Your expertise" error={errors.expertise} required>
          <NativeSelect.Root maxW="24rem" disabled={readOnly}>
            <NativeSelect.Field {...register('expertise')}>
              <option value="">Choose…</option>
              {([1, 2, 3] as const).map((n) => (
                <option key={n} value={String(n)}>
                  {EXPERTISE_LABELS[n]}
                </option>
              ))}
            </NativeSelect.Field>
            <NativeSelect.Indicator />
          </NativeSelect.Root>
        </FormField>
        <FormField
          label="Comment to the PI"
          helperText="Sent to the team with the outcome, without your name."
          error={errors.commentToPi}
          required
        >
          <Textarea {...register('commentToPi')} rows={8} autoresize readOnly={readOnly} />
        </FormField>
        <FormField
          label="Comment to the committee"
          helperText="Read by the chair only."
          error={errors.commentToCommittee}
        >
          <Textarea {...register('commentToCommittee')} rows={5} autoresize readOnly={readOnly} />
        </FormField>
        <FormError error={errors.root?.server} />
        {readOnly ? (
          <Text color="fg.muted">This review can no longer change.</Text>
        ) : (
          <HStack gap="3" wrap="wrap">
            {!submitted && (
              <Button variant="outline" loading={save.isPending} onClick={() => void send(false)()}>
                Save draft
              </Button>
            )}
            <Button type="submit" colorPalette="brand" loading={save.isPending}>
              {submitted ? 'Save changes' : 'Submit review'}
            </Button>
            {isDirty && <Text color="fg.muted">Unsaved changes</Text>}
          </HStack>
        )}
      </form>
    </Stack>
  );
}
