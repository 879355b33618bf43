import { useState } from 'react';
import { useNavigate } from 'react-router';
import { calculators } from '@wickstone/calc-core';
import { createWidgetBodySchema } from '@wickstone/contracts';
import { useSchemaForm } from '../lib/form';
import { useOrg } from '../lib/org-context';
import { usePageTitle } from '../lib/use-page-title';
import { orgPath } from '../nav';
import { useCreateWidget } from '../queries/widgets';
import { SchemaFormView, TextField } from '../components/form';
import { Button, ButtonLink, Card, PageHeader } from '../components/ui';
import { ChoiceCards } from '../components/widget-fields';
import { UpgradeHint } from '../components/upgrade-hint';

export function NewWidgetPage() {
  usePageTitle('New widget');
  const { orgId } = useOrg();
  const navigate = useNavigate();
  const create = useCreateWidget(orgId);
  const [calculatorId, setCalculatorId] = useState('');
  const form = useSchemaForm(
    createWidgetBodySchema,
    (body: { name: string; calculatorId: string }, { showServerError }) =>
      create.mutate(body, {
        onSuccess: (widget) => void navigate(orgPath(orgId, `widgets/${widget.id}`)),
        onError: (error) => showServerError(error),
      }),
  );

  return (
    <section className="space-y-6">
      <PageHeader
        title="New widget"
        lead="Start from one of the calculators. Everything else (defaults, units, look, request form, sites) is set in the editor that opens next; the widget stays a draft until you make it live."
      />
      <Card className="p-5">
        <SchemaFormView form={form} labelledBy="new-widget-title" className="space-y-5">
          <h2 id="new-widget-title" className="sr-only">
            Create a widget
          </h2>
          <ChoiceCards
            legend="Calculator"
            name="calculatorId"
            value={calculatorId}
            onChange={setCalculatorId}
            disabled={create.isPending}
            // Picked from cards, so "Required" alone would not say what is missing.
            error={form.errors.calculatorId === 'Required' ? 'Choose a calculator' : form.errors.calculatorId}
            columns="md:grid-cols-2"
            options={calculators.map((c) => ({
              value: c.id,
              label: c.title,
              detail: (
                <>
                  {c.summary}
                  <span className="mt-1 block text-xs">
                    {c.inputs.length} inputs · {c.cautions.length} built-in cautions
                  </span>
                </>
              ),
            }))}
          />
          <div className="max-w-lg">
            <TextField
              label="Name"
              name="name"
              autoComplete="off"
              maxLength={120}
              hint="For example: Rising damp check. Visitors see it above the calculator's title; your team sees it in lists."
              error={form.errors.name}
            />
          </div>
          <div className="flex flex-wrap gap-2">
            <Button type="submit" tone="primary" busy={create.isPending}>
              Create the widget
            </Button>
            <ButtonLink to={orgPath(orgId, 'widgets')}>Cancel</ButtonLink>
          </div>
          <UpgradeHint error={create.error} />
        </SchemaFormView>
      </Card>
    </section>
  );
}
