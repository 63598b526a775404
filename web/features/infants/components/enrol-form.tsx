import { useEffect, useRef, useState, type FormEvent } from 'react';
import { FormProvider, useForm, type FieldErrors, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate } from 'react-router-dom';
import { enrolInfantSchemaFor, type EnrolInfantInput } from '@shared/schemas/infant-contacts';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { Button } from '../../../components/ui/button';
import { detailMessages, errorMessage, isApiError } from '../../../lib/api-error';
import { WeightConfirm } from '../../../components/clinical/weight-confirm';
import { useSignedInUser } from '../../../lib/signed-in-user';
import { useEnrolInfant } from '../api/enrol-infant';
import { EnrolBabyStep } from './enrol-baby-step';
import { EnrolCareStep } from './enrol-care-step';
import { EnrolCheckStep } from './enrol-check-step';
import { HomeFields } from './enrol-home-step';
import { EnrolHospitalStep } from './enrol-hospital-step';
import { EnrolPreview } from './enrol-preview';
import { EnrolStepper } from './enrol-stepper';
import { ENROL_STEPS, LAST_STEP, enrolDefaults, stepOfPath, type EnrolValues } from './enrol-values';
import { todayIn } from './form-helpers';

function stepsWithErrors(errors: FieldErrors<EnrolValues>): Set<number> {
  return new Set(Object.keys(errors).map(stepOfPath).filter((step): step is number => step !== null));
}

export function EnrolForm() {
  const user = useSignedInUser();
  const navigate = useNavigate();
  const enrol = useEnrolInfant();
  const [defaults] = useState(() => enrolDefaults(user.programmeTimeZone, todayIn(user.programmeTimeZone)));
  const form = useForm<EnrolValues, unknown, EnrolInfantInput>({
    resolver: zodResolver(enrolInfantSchemaFor(user.programmeCountry)),
    defaultValues: defaults,
    mode: 'onTouched',
  });
  const { trigger, setError, handleSubmit, formState, control } = form;
  const [step, setStep] = useState(0);
  const [serverProblem, setServerProblem] = useState<string>();
  const [weightWarnings, setWeightWarnings] = useState<string[] | null>(null);
  // A second click can arrive before React re-renders the disabled button; this closes that gap.
  const inFlight = useRef(false);
  const heading = useRef<HTMLHeadingElement>(null);
  // Focus follows a step the person moved to; a step that stops them sends focus to the error summary instead.
  const moved = useRef(false);
  // Each "Next" (or step link, or save) stopped by a problem: the error summary takes focus each time.
  const [stopped, setStopped] = useState(0);
  // Steps a "Next" has checked and passed, ticked in the step bar.
  const [passed, setPassed] = useState<ReadonlySet<number>>(new Set());

  useEffect(() => {
    if (moved.current) heading.current?.focus();
    moved.current = false;
  }, [step]);

  const go = async (target: number) => {
    for (let at = step; at < target; at += 1) {
      const fields = ENROL_STEPS[at].fields as readonly Path<EnrolValues>[];
      if (fields.length && !(await trigger([...fields]))) {
        setStep(at);
        setStopped((n) => n + 1);
        return;
      }
      setPassed((done) => new Set(done).add(at));
    }
    moved.current = true;
    setStep(target);
  };

  const onServerError = (error: unknown) => {
    if (isApiError(error) && error.code === 'needs_confirmation') {
      setWeightWarnings(detailMessages(error.details?.['baby.weightKg']));
      return;
    }
    if (!isApiError(error) || error.code !== 'validation_failed' || !error.details) {
      setServerProblem(errorMessage(error));
      return;
    }
    const leftover: string[] = [];
    let first: number | null = null;
    for (const [path, messages] of Object.entries(error.details)) {
      const at = stepOfPath(path);
      if (at === null) leftover.push(detailMessages(messages).join(' '));
      else {
        setError(path as Path<EnrolValues>, { type: 'server', message: detailMessages(messages).join(' ') });
        first = first === null ? at : Math.min(first, at);
      }
    }
    setServerProblem(leftover.length ? leftover.join(' ') : error.message);
    if (first !== null) setStep(first);
    setStopped((n) => n + 1);
  };

  const save = async (values: EnrolInfantInput) => {
    setServerProblem(undefined);
    try {
      const infant = await enrol.mutateAsync(values);
      navigate(`/infants/${infant.id}`);
    } catch (error) {
      onServerError(error);
    }
  };

  const onSubmit = async (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    // Enter in a field of an earlier step means "next", never "save".
    if (step < LAST_STEP) return void go(step + 1);
    if (inFlight.current) return;
    inFlight.current = true;
    try {
      await handleSubmit(save, (errors) => {
        setStep(Math.min(...stepsWithErrors(errors)));
        setStopped((n) => n + 1);
      })();
    } finally {
      inFlight.current = false;
    }
  };

  const current = ENROL_STEPS[step];
  const pending = enrol.isPending || formState.isSubmitting;
  return (
    <FormProvider {...form}>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_24rem] lg:items-start">
        <form onSubmit={onSubmit} noValidate aria-labelledby="enrol-step-title" className="flex min-w-0 flex-col gap-5">
          <EnrolStepper current={step} done={passed} withErrors={stepsWithErrors(formState.errors)} onGo={go} />
          <ErrorSummary attempt={stopped} problem={serverProblem} />
          <section className="rounded-2xl border border-surface-200 bg-surface-0 p-4 shadow-sm sm:p-6">
            <h2 id="enrol-step-title" ref={heading} tabIndex={-1} className="mb-4 text-xl font-bold text-ink-900">
              Step {step + 1} of {ENROL_STEPS.length}: {current.title}
            </h2>
            {step === 0 && <EnrolBabyStep />}
            {step === 1 && <EnrolHospitalStep />}
            {step === 2 && <HomeFields />}
            {step === 3 && <EnrolCareStep />}
            {step === 4 && <EnrolCheckStep control={control} onEdit={(to) => { moved.current = true; setStep(to); }} />}
            {step === 4 && weightWarnings && <WeightConfirm warnings={weightWarnings} name="baby.weightConfirmed" />}
          </section>
          <div className="flex flex-wrap justify-between gap-3">
            <Button variant="secondary" onClick={() => { moved.current = true; setStep(step - 1); }} disabled={step === 0 || pending}>
              Back
            </Button>
            {/* Distinct keys: reusing one DOM button and flipping its type to submit mid-click would save the form
                the moment the last step opens. */}
            {step < LAST_STEP ? (
              <Button key="next" onClick={() => go(step + 1)}>
                Next: {ENROL_STEPS[step + 1].title}
              </Button>
            ) : (
              <Button key="save" type="submit" disabled={pending}>
                {pending ? 'Saving…' : 'Enrol baby'}
              </Button>
            )}
          </div>
        </form>
        <div className="lg:sticky lg:top-4">
          <EnrolPreview control={control} />
        </div>
      </div>
    </FormProvider>
  );
}
