import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useRouter } from 'expo-router';
import * as DocumentPicker from 'expo-document-picker';
import { MAX_DEPOTS, MAX_FILE_BYTES, MAX_LANES } from '../../shared/formats/types';
import type { ImportPreview } from '../../shared/schemas/networks';
import { ApiError } from '../api/client';
import { useImportMutation, useImportPreviewMutation, type ImportRequest, type PickedFile } from '../queries/networks';
import { colors, radius, space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Body, Heading, Label, Small } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { formatVolume } from './format';
import { SummaryBar } from './SummaryBar';

const ACCEPT = ['.csv', '.txt', '.json', '.geojson', '.graphml', 'text/csv', 'text/plain', 'application/json', 'application/geo+json', 'application/xml', 'text/xml'];

const MAPPING_FIELDS: { key: string; label: string; domain: 'node' | 'edge' }[] = [
  { key: 'laneWeight', label: 'Lane volume', domain: 'edge' },
  { key: 'depotName', label: 'Depot name', domain: 'node' },
  { key: 'depotLat', label: 'Latitude', domain: 'node' },
  { key: 'depotLon', label: 'Longitude', domain: 'node' },
  { key: 'depotWeight', label: 'Depot weight', domain: 'node' },
];

async function pick(): Promise<PickedFile | null> {
  const r = await DocumentPicker.getDocumentAsync({ type: ACCEPT, multiple: false, copyToCacheDirectory: true });
  if (r.canceled || !r.assets?.[0]) return null;
  const a = r.assets[0];
  return { name: a.name, uri: a.uri, ...(a.mimeType ? { mimeType: a.mimeType } : {}), ...(a.file ? { file: a.file } : {}) };
}

/**
 * /networks/import — choose a file (and, for CSV, an optional depots file), see what would be
 * imported with every problem and its fix, confirm the GraphML key mapping, then import. Nothing
 * is saved while the file has errors unless the user chooses to leave the bad rows out.
 */
export function ImportScreen(props: { networkId?: number }) {
  const router = useRouter();
  const preview = useImportPreviewMutation();
  const save = useImportMutation();
  const [file, setFile] = useState<PickedFile | null>(null);
  const [depots, setDepots] = useState<PickedFile | null>(null);
  const [mapping, setMapping] = useState<Record<string, string>>({});
  const [name, setName] = useState('');

  const request = (over: Partial<ImportRequest> = {}): ImportRequest | null => {
    const f = over.file ?? file;
    if (!f) return null;
    return { file: f, depots: over.depots !== undefined ? over.depots : depots, mapping: over.mapping ?? mapping, ...(name ? { name } : {}), ...(props.networkId ? { networkId: props.networkId } : {}) };
  };
  const runPreview = (over: Partial<ImportRequest>) => {
    const r = request(over);
    if (!r) return;
    save.reset();
    preview.mutate(r, { onSuccess: (p) => setName((n) => n || p.suggestedName) });
  };
  const chooseMain = async () => {
    const f = await pick();
    if (!f) return;
    setFile(f);
    setMapping({});
    runPreview({ file: f, mapping: {} });
  };
  const chooseDepots = async () => {
    const f = await pick();
    if (!f) return;
    setDepots(f);
    runPreview({ depots: f });
  };
  const doImport = (dropBadRows: boolean) => {
    const r = request();
    if (!r) return;
    save.mutate({ ...r, dropBadRows }, { onSuccess: (res) => router.replace(`/networks/${res.id}`) });
  };

  const p = preview.data;
  const isCsv = p?.format === 'csv' || (!!file && file.name.toLowerCase().endsWith('.csv'));
  const serverIssues = save.error instanceof ApiError && Array.isArray(save.error.body?.issues) ? (save.error.body!.issues as ImportPreview['issues']) : null;

  return (
    <Screen
      title={props.networkId ? 'Import a new version' : 'Import a network'}
      subtitle="CSV, GeoJSON, GraphML, edge list or Spinyard JSON. You see what will be imported before anything is saved."
      actions={<Button label="All networks" tone="secondary" onPress={() => router.push('/networks')} />}
      maxWidth={960}
      testID="import-screen"
    >
      <Card>
        <Heading>1. Choose the file</Heading>
        <Small testID="import-limits">
          Up to {formatVolume(MAX_FILE_BYTES / (1024 * 1024))} MB per file, {formatVolume(MAX_DEPOTS)} depots and {formatVolume(MAX_LANES)} lanes. CSV: a lanes file with the header from,to,weight and, if you have one, a depots file with id,name,lat,lon,weight. GeoJSON: Points are depots, LineStrings with a weight are lanes. GraphML: you confirm which data keys hold volumes and names. Edge list: "n m" then "i j w" per line.
        </Small>
        <View style={styles.row}>
          <Button label={file ? `Network file: ${file.name}` : 'Choose network file'} onPress={chooseMain} testID="choose-file" accessibilityHint="Opens the file chooser" />
          {isCsv ? <Button label={depots ? `Depots file: ${depots.name}` : 'Add depots file (optional)'} tone="secondary" onPress={chooseDepots} testID="choose-depots" /> : null}
          {depots ? <Button label="Remove depots file" tone="quiet" onPress={() => { setDepots(null); runPreview({ depots: null }); }} /> : null}
        </View>
      </Card>

      {preview.isPending ? <Body>Reading the file…</Body> : null}
      {preview.isError ? <Notice tone="error" testID="preview-error">{preview.error.message}</Notice> : null}
      {p ? <PreviewView preview={p} mapping={mapping} onMapping={(m) => { setMapping(m); runPreview({ mapping: m }); }} /> : null}

      {p ? (
        <Card>
          <Heading>3. Import</Heading>
          {!props.networkId ? <TextField label="Network name" value={name} onChangeText={setName} /> : null}
          {save.isError ? (
            <Notice tone="error" testID="import-error">
              <Body>{save.error.message}</Body>
              {serverIssues ? <Small>{serverIssues.length} problem(s) listed above; nothing was saved.</Small> : null}
            </Notice>
          ) : null}
          <View style={styles.row}>
            <Button label={p.errorCount === 0 ? `Import ${formatVolume(p.counts.depots)} depots and ${formatVolume(p.counts.lanes)} lanes` : 'Import'} disabled={p.errorCount > 0} busy={save.isPending} onPress={() => doImport(false)} testID="import-save" />
            {p.errorCount > 0 && p.counts.depots > 0 ? (
              <Button label={`Leave out the bad rows and import ${formatVolume(p.counts.depots)} depots, ${formatVolume(p.counts.lanes)} lanes`} tone="secondary" busy={save.isPending} onPress={() => doImport(true)} testID="import-drop-bad" />
            ) : null}
          </View>
          {p.errorCount > 0 ? <Small>Fix the file and choose it again, or leave the bad rows out. Nothing is saved until you import.</Small> : null}
        </Card>
      ) : null}
    </Screen>
  );
}

export function PreviewView(props: { preview: ImportPreview; mapping: Record<string, string>; onMapping: (m: Record<string, string>) => void }) {
  const p = props.preview;
  const errors = p.issues.filter((i) => i.severity === 'error');
  const warnings = p.issues.filter((i) => i.severity === 'warning');
  return (
    <Card testID="import-preview">
      <Heading>2. Check what will be imported</Heading>
      <Body testID="preview-counts">
        {p.fileName}{p.depotsFileName ? ` + ${p.depotsFileName}` : ''} read as {p.format ?? 'an unknown format'}: {formatVolume(p.counts.depots)} depots and {formatVolume(p.counts.lanes)} lanes passed every check.
      </Body>
      {errors.length > 0 ? (
        <Notice tone="error" testID="preview-errors">
          <Label style={styles.issueTitle}>{p.errorCount} error{p.errorCount === 1 ? '' : 's'} — nothing will be saved as it stands</Label>
          {errors.slice(0, 30).map((i, k) => (
            <Small key={k} style={styles.issue}>• {i.text}</Small>
          ))}
          {errors.length > 30 ? <Small>… and {errors.length - 30} more</Small> : null}
        </Notice>
      ) : (
        <Notice tone="success" testID="preview-ok">No errors found.</Notice>
      )}
      {p.summary ? <SummaryBar summary={p.summary} testID="preview-summary" /> : null}
      {warnings.length > 0 ? (
        <Notice tone="caution" testID="preview-warnings">
          {warnings.slice(0, 10).map((i, k) => (
            <Small key={k} style={styles.issue}>• {i.text}</Small>
          ))}
        </Notice>
      ) : null}
      {p.graphml ? <MappingView preview={p} mapping={props.mapping} onMapping={props.onMapping} /> : null}
      {p.firstLanes.length > 0 ? (
        <View style={styles.sample}>
          <Label>First lanes</Label>
          {p.firstLanes.map((l, k) => (
            <Small key={k} style={styles.mono}>{l.from} – {l.to}: {l.weight}</Small>
          ))}
        </View>
      ) : null}
      {p.firstDepots.length > 0 ? (
        <View style={styles.sample}>
          <Label>First depots</Label>
          {p.firstDepots.map((d) => (
            <Small key={d.id} style={styles.mono}>
              {d.id}{d.name ? ` · ${d.name}` : ''}{d.lat !== undefined ? ` · ${d.lat}, ${d.lon}` : ''}{d.weight !== undefined ? ` · weight ${d.weight}` : ''}
            </Small>
          ))}
        </View>
      ) : null}
    </Card>
  );
}

/** GraphML: which declared key feeds which field; the user confirms or changes each choice. */
function MappingView(props: { preview: ImportPreview; mapping: Record<string, string>; onMapping: (m: Record<string, string>) => void }) {
  const g = props.preview.graphml!;
  return (
    <View style={styles.mapping} testID="graphml-mapping">
      <Label>Data keys in this file</Label>
      <Small>Check that each field reads the right key; change it if not. The preview updates.</Small>
      {MAPPING_FIELDS.map((f) => {
        const options = g.keys.filter((k) => k.for === f.domain || k.for === 'all');
        const current = props.mapping[f.key] ?? g.mapping[f.key] ?? null;
        return (
          <View key={f.key} style={styles.mapRow}>
            <Small style={styles.mapLabel}>{f.label}</Small>
            {options.length === 0 ? <Small>no {f.domain} keys</Small> : null}
            {options.map((k) => (
              <Button
                key={k.id}
                label={k.name ? `${k.id} (${k.name})` : k.id}
                tone={current === k.id ? 'primary' : 'secondary'}
                onPress={() => props.onMapping({ ...props.mapping, [f.key]: k.id })}
                accessibilityHint={`Read ${f.label.toLowerCase()} from key ${k.id}`}
              />
            ))}
            {current === null && options.length > 0 ? <Small>not read{f.key === 'laneWeight' ? ' (every lane weighs 1)' : ''}</Small> : null}
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  issueTitle: { color: colors.danger, fontSize: 15 },
  issue: { color: colors.text },
  sample: { gap: 2, padding: space.md, backgroundColor: colors.surfaceSunk, borderRadius: radius.md },
  mono: { fontFamily: 'monospace', color: colors.text },
  mapping: { gap: space.sm, padding: space.md, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md },
  mapRow: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, alignItems: 'center' },
  mapLabel: { width: 110, color: colors.text },
});
