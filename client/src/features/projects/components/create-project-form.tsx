import { STANDARDS, createProjectRequestSchema, type Project } from '@shared/api';
import { useZodForm } from '../../../lib/form';
import { Button, Notice, Select, TextField } from '../../../ui';
import { useCreateProject } from '../api/use-create-project';
import { standardName } from './standard-name';

const initial = { name: '', description: '', standard: '', defaultGrade: '' };

const standardOptions = [
  { value: '', label: 'Decide later (server default)' },
  ...STANDARDS.map((id) => ({ value: id, label: standardName(id) })),
];

const blankToUndefined = (value: string) => (value.trim() === '' ? undefined : value);

/** Name, description, design standard and default steel grade for a new project. */
export function CreateProjectForm({ onCreated }: { onCreated: (project: Project) => void }) {
  const create = useCreateProject();
  const form = useZodForm({
    initial,
    schema: createProjectRequestSchema,
    prepare: (v) => ({
      name: v.name,
      description: blankToUndefined(v.description),
      standard: blankToUndefined(v.standard),
      defaultGrade: blankToUndefined(v.defaultGrade),
    }),
  });

  const submit = form.formProps(async (request) => {
    const project = await create.mutateAsync(request);
    form.reset();
    onCreated(project);
  });

  return (
    <form {...submit} aria-label="New project" className="flex flex-col gap-5">
      {form.formError && (
        <Notice tone="error" ref={form.noticeRef} title="Project not created">
          {form.formError}
        </Notice>
      )}
      <TextField label="Project name" autoComplete="off" {...form.field('name')} />
      <TextField label="Description" optional multiline rows={3} description="What the project is and which parts of the structure it covers." {...form.field('description')} />
      <Select
        label="Design standard"
        optional
        options={standardOptions}
        description="The standard and edition every check in this project follows. It can be changed later."
        {...form.field('standard')}
      />
      <TextField
        label="Default steel grade"
        optional
        autoComplete="off"
        description="Used where the model gives no grade, e.g. 300, A992 or S355. Every assumed value is shown for review."
        {...form.field('defaultGrade')}
      />
      <div>
        <Button type="submit" busy={create.isPending}>
          {create.isPending ? 'Creating…' : 'Create project'}
        </Button>
      </div>
    </form>
  );
}
