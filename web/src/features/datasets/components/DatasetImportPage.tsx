import '@mantine/dropzone/styles.css';
import { Alert, Button, Group, List, SegmentedControl, Stack, Text, TextInput, Title } from '@mantine/core';
import { Dropzone } from '@mantine/dropzone';
import type { DatasetKind, DatasetMapping, FileLayout } from '@provenote/shared/schemas';
import { useState } from 'react';
import { useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { errorMessage } from '../../../app/api-client';
import { useAddVersion, useCreateDataset, usePreview, useUploadFile } from '../api/datasets';
import { MappingForm } from './MappingForm';
import { ProblemList } from './ProblemList';
import { RowsTable } from './RowsTable';
import { SummaryCounts } from './SummaryCounts';

const ACCEPT = [
  'text/csv',
  'text/plain',
  'text/tab-separated-values',
  'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  'application/vnd.ms-excel',
];

/** Upload → confirm the mapping → preview → import, as a new dataset or (with ?datasetId=) its next version. */
export function DatasetImportPage() {
  const { labId = '' } = useParams();
  const [search] = useSearchParams();
  const datasetId = search.get('datasetId');
  const navigate = useNavigate();
  const upload = useUploadFile(labId);
  const preview = usePreview(labId);
  const create = useCreateDataset(labId);
  const addVersion = useAddVersion(labId, datasetId ?? '');
  const [layout, setLayout] = useState<FileLayout | null>(null);
  const [mapping, setMapping] = useState<DatasetMapping | null>(null);
  const [name, setName] = useState('');
  const [kind, setKind] = useState<DatasetKind>('reference');
  const saving = create.isPending || addVersion.isPending;
  const saveError = create.error ?? addVersion.error;

  const onDrop = (files: File[]) =>
    upload.mutate(files[0], {
      onSuccess: (result) => {
        setLayout(result);
        setMapping(result.mapping);
        setName(result.file.filename.replace(/\.[^.]+$/, ''));
        preview.reset();
      },
    });
  const changeMapping = (next: DatasetMapping) => {
    setMapping(next);
    preview.reset();
  };
  const save = () => {
    if (!layout || !mapping) return;
    const done = { onSuccess: (dataset: { id: string }) => navigate(`/labs/${labId}/datasets/${dataset.id}`) };
    if (datasetId) addVersion.mutate({ fileId: layout.file.id, mapping, note: '' }, done);
    else create.mutate({ name, kind, fileId: layout.file.id, mapping }, done);
  };

  return (
    <Stack>
      <Title order={2}>{datasetId ? 'Import a corrected file as a new version' : 'Import a data file'}</Title>
      <Dropzone onDrop={onDrop} loading={upload.isPending} multiple={false} accept={ACCEPT} aria-label="Data file">
        <Text ta="center">Drop a CSV, TSV or .xlsx file here, or click to choose one.</Text>
        <Text ta="center" size="sm" c="dimmed">
          The file is kept byte for byte, with its SHA-256, whatever you choose below.
        </Text>
      </Dropzone>
      {upload.error && (
        <Alert color="red" title="The file was not accepted">
          {errorMessage(upload.error)}
        </Alert>
      )}
      {layout && mapping && (
        <>
          <Text size="sm">
            {layout.file.filename} · SHA-256 <code>{layout.file.sha256.slice(0, 16)}…</code> ·{' '}
            {layout.mappingSource === 'saved'
              ? 'mapping saved for this layout, offered again'
              : 'mapping guessed from the headers'}
          </Text>
          {layout.notes.length > 0 && (
            <List size="sm">
              {layout.notes.map((note) => (
                <List.Item key={note}>{note}</List.Item>
              ))}
            </List>
          )}
          {!datasetId && (
            <Group align="end">
              <TextInput
                label="Dataset name"
                value={name}
                onChange={(event) => setName(event.currentTarget.value)}
                required
              />
              <SegmentedControl
                aria-label="Kind of data"
                value={kind}
                onChange={(value) => setKind(value as DatasetKind)}
                data={[
                  { value: 'reference', label: 'Reference data (with groups)' },
                  { value: 'unknowns', label: 'Unknowns to assign' },
                ]}
              />
            </Group>
          )}
          <MappingForm mapping={mapping} onChange={changeMapping} unitsRow={layout.unitsRow} />
          <Group>
            <Button
              variant="light"
              onClick={() => preview.mutate({ fileId: layout.file.id, mapping })}
              loading={preview.isPending}
            >
              Preview
            </Button>
            <Button onClick={save} loading={saving} disabled={!preview.data}>
              Import
            </Button>
          </Group>
          {preview.error && (
            <Alert color="red" title="The mapping does not fit">
              {errorMessage(preview.error)}
            </Alert>
          )}
          {saveError && (
            <Alert color="red" title="Not imported">
              {errorMessage(saveError)}
            </Alert>
          )}
          {preview.data && (
            <Stack>
              <SummaryCounts summary={preview.data.summary} />
              <RowsTable columns={preview.data.columns} rows={preview.data.rows} />
              <ProblemList problems={preview.data.problems} total={preview.data.problemCount} />
            </Stack>
          )}
        </>
      )}
    </Stack>
  );
}
