import { Button, Field, HStack, Input, Stack, Text } from '@chakra-ui/react';
import type { ScanDetail } from '@sixtyfold/shared';
import { useState } from 'react';
import { DialogFrame } from '@/components/ui/dialog-frame';
import { FailureAlert } from '@/components/ui/failure-alert';
import { SelectField } from '@/components/ui/select-field';
import { formatDuration } from '@/lib/format-duration';
import { useRefineEstimate } from '../api/get-refine-estimate';
import { useRefineScan } from '../api/refine-scan';
import { defaultRefineSettings, estimateQuery, REFINE_OUTPUTS, refineRequest, type RefineSettings } from '../utils/refine-settings';

interface RefineDialogProps {
  /** A completed grid scan; the dialog is open while there is one. */
  scan: ScanDetail | null;
  onClose: () => void;
  /** Called with the first level once it is queued. */
  onLaunched: (level: ScanDetail) => void;
}

const FACTORS = ['1', '2', '3', '4'].map((f) => ({ value: f, label: f === '1' ? '1 (not split)' : `${f}` }));
const DEPTHS = ['1', '2', '3', '4'].map((d) => ({ value: d, label: d }));

/** Refine a finished grid where a boundary crosses it: the settings, the first level's estimate, then launch. */
export function RefineDialog({ scan, onClose, onLaunched }: RefineDialogProps) {
  const axes = (scan?.spec.axes ?? []).map((axis) => axis.parameter);
  const [settings, setSettings] = useState<RefineSettings>(() => defaultRefineSettings(axes));
  const request = refineRequest(settings);
  const estimate = useRefineEstimate(scan?.id ?? 0, scan && request.body ? estimateQuery(request.body) : null);
  const refine = useRefineScan({ onSuccess: onLaunched });
  const set = <K extends keyof RefineSettings>(key: K) => (value: RefineSettings[K]) => setSettings((s) => ({ ...s, [key]: value }));
  const close = () => {
    refine.reset();
    onClose();
  };

  return (
    <DialogFrame
      open={scan !== null}
      title={`Refine “${scan?.name}”`}
      onClose={close}
      footer={
        <HStack gap="2">
          <Button variant="outline" onClick={close}>Close</Button>
          <Button
            disabled={!request.body || !estimate.data || estimate.isError}
            loading={refine.isPending}
            loadingText="Launching…"
            onClick={() => scan && request.body && refine.mutate({ scanId: scan.id, body: request.body })}
          >
            Launch refinement
          </Button>
        </HStack>
      }
    >
      <Stack gap="4">
        <Text fontSize="sm" color="fg.muted">
          Follow-up scans split only the cells the boundary passes through, level by level, on the same workers; this scan&apos;s
          heatmaps and constraints then show every level merged.
        </Text>
        <HStack gap="3" wrap="wrap" align="end">
          <SelectField
            label="Boundary"
            value={settings.kind}
            options={[{ value: 'likelihood', label: 'A likelihood region' }, { value: 'output', label: 'A level of an output' }]}
            onChange={(v) => set('kind')(v as RefineSettings['kind'])}
          />
          {settings.kind === 'likelihood' ? (
            <>
              <Field.Root w="auto">
                <Field.Label fontSize="sm">Likelihood set</Field.Label>
                <Input size="sm" bg="bg.panel" value={settings.likelihood} onChange={(e) => set('likelihood')(e.target.value)} />
              </Field.Root>
              <SelectField label="Region" value={settings.level} options={[{ value: '68', label: '68 %' }, { value: '95', label: '95 %' }]} onChange={(v) => set('level')(v as RefineSettings['level'])} minW="24" />
            </>
          ) : (
            <>
              <SelectField label="Output" value={settings.output} options={REFINE_OUTPUTS.map((o) => ({ value: o, label: o }))} onChange={(v) => set('output')(v as RefineSettings['output'])} minW="24" />
              <Field.Root w="auto">
                <Field.Label fontSize="sm">at</Field.Label>
                <Input size="sm" bg="bg.panel" inputMode="decimal" value={settings.value} onChange={(e) => set('value')(e.target.value)} />
              </Field.Root>
            </>
          )}
        </HStack>
        <HStack gap="3" wrap="wrap" align="end">
          {axes.map((axis) => (
            <SelectField
              key={axis}
              label={`Factor on ${axis}`}
              value={settings.factors[axis] ?? '2'}
              options={FACTORS}
              onChange={(v) => setSettings((s) => ({ ...s, factors: { ...s.factors, [axis]: v } }))}
              minW="28"
            />
          ))}
          <SelectField label="Depth (levels)" value={settings.depth} options={DEPTHS} onChange={set('depth')} minW="24" />
        </HStack>
        {request.problem && <Text fontSize="sm" color="fg.error">{request.problem}</Text>}
        {estimate.isError && <FailureAlert title="No refinement with these settings" size="sm">{estimate.error.message}</FailureAlert>}
        {estimate.data && !estimate.isError && (
          <Text fontSize="sm" data-testid="refine-estimate">
            Level 1: {estimate.data.points.toLocaleString('en-US')} points in {estimate.data.crossedCells.toLocaleString('en-US')} of{' '}
            {estimate.data.cells.toLocaleString('en-US')} cells
            {estimate.data.seconds !== null ? `, about ${formatDuration(estimate.data.seconds)} at this scan's pace` : ''}; the finest level has{' '}
            {estimate.data.finestLengths.join(' × ')} nodes. Later levels follow as each completes.
          </Text>
        )}
        {refine.isError && <FailureAlert title="Could not launch the refinement" size="sm">{refine.error.message}</FailureAlert>}
      </Stack>
    </DialogFrame>
  );
}
