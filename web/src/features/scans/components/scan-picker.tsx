import { Checkbox, HStack, Stack, Text } from '@chakra-ui/react';
import type { ScanSummary } from '@sixtyfold/shared';
import { DateTime } from '@/components/ui/date-time';
import { MAX_COMPARED_SCANS } from '../utils/scan-ids-param';
import { methodLabels } from '@/lib/method-labels';

interface ScanPickerProps {
  scans: ScanSummary[];
  selected: number[];
  onChange: (ids: number[]) => void;
  groupNames: Map<number, string>;
}

/** Checkbox list of completed scans; once four are picked the rest are disabled. */
export function ScanPicker({ scans, selected, onChange, groupNames }: ScanPickerProps) {
  const full = selected.length >= MAX_COMPARED_SCANS;
  const toggle = (id: number, checked: boolean) =>
    onChange(checked ? [...selected, id] : selected.filter((other) => other !== id));

  return (
    <Stack gap="0" role="group" aria-label="Completed scans to compare">
      {scans.map((scan, index) => {
        const checked = selected.includes(scan.id);
        return (
          <Checkbox.Root
            key={scan.id}
            checked={checked}
            disabled={!checked && full}
            onCheckedChange={(details) => toggle(scan.id, details.checked === true)}
            colorPalette="ember"
            alignItems="start"
            px="4"
            py="3"
            borderTopWidth={index === 0 ? '0' : '1px'}
            borderColor="border.muted"
            bg={checked ? 'ember.subtle' : undefined}
            _hover={{ bg: checked ? 'ember.subtle' : 'bg.subtle' }}
            cursor="pointer"
            w="full"
          >
            <Checkbox.HiddenInput />
            <Checkbox.Control mt="0.5" />
            <Checkbox.Label flex="1" fontWeight="400">
              <HStack as="span" justify="space-between" gap="4" wrap="wrap">
                <Text as="span" fontWeight="500" color="ink.900">
                  {scan.name}
                </Text>
                <Text as="span" fontSize="xs" color="fg.muted" fontFamily="mono">
                  {scan.totalPoints.toLocaleString()} points
                </Text>
              </HStack>
              <Text as="span" display="block" fontSize="sm" color="fg.muted">
                {groupNames.get(scan.groupId) ?? `Group ${scan.groupId}`} · {scan.ownerName} · {methodLabels[scan.method]} · finished{' '}
                <DateTime iso={scan.finishedAt} />
              </Text>
            </Checkbox.Label>
          </Checkbox.Root>
        );
      })}
    </Stack>
  );
}
