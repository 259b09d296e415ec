import { Box, DataList, Heading, Link, Stack, Text } from '@chakra-ui/react';
import type { OutboxMessage } from '@sixtyfold/shared';
import { DateTime } from '@/components/ui/date-time';
import { Panel } from '@/components/ui/panel';
import { splitLinks } from '../utils/split-links';

/** One caught message: its headers, the text body with clickable links, and the HTML body in a locked-down frame. */
export function OutboxMessageView({ message }: { message: OutboxMessage }) {
  return (
    <Stack gap="6">
      <Panel p="4">
        <DataList.Root orientation="horizontal" size="sm">
          <DataList.Item>
            <DataList.ItemLabel>From</DataList.ItemLabel>
            <DataList.ItemValue>{message.from ?? '—'}</DataList.ItemValue>
          </DataList.Item>
          <DataList.Item>
            <DataList.ItemLabel>To</DataList.ItemLabel>
            <DataList.ItemValue>{message.to.join(', ')}</DataList.ItemValue>
          </DataList.Item>
          <DataList.Item>
            <DataList.ItemLabel>Received</DataList.ItemLabel>
            <DataList.ItemValue>
              <DateTime iso={message.receivedAt} />
            </DataList.ItemValue>
          </DataList.Item>
        </DataList.Root>
      </Panel>
      <Box as="section" aria-labelledby="outbox-text">
        <Heading as="h2" id="outbox-text" size="md" color="ink.900" mb="2">
          Text version
        </Heading>
        <Panel p="4">
          <Text as="pre" whiteSpace="pre-wrap" fontFamily="mono" fontSize="sm" data-testid="outbox-text-body">
            {splitLinks(message.text).map((part, i) =>
              part.kind === 'link' ? (
                <Link key={i} href={part.href} color="ember.700" textDecoration="underline">
                  {part.href}
                </Link>
              ) : (
                part.text
              ),
            )}
          </Text>
        </Panel>
      </Box>
      <Box as="section" aria-labelledby="outbox-html">
        <Heading as="h2" id="outbox-html" size="md" color="ink.900" mb="2">
          HTML version
        </Heading>
        {message.html ? (
          <Panel>
            {/* sandbox="" : no scripts, no forms, no navigation of this page from inside the message. */}
            <iframe title="HTML version of the message" sandbox="" srcDoc={message.html} style={{ width: '100%', height: '28rem', border: 0, background: 'white' }} />
          </Panel>
        ) : (
          <Text color="fg.muted">This message has no HTML version.</Text>
        )}
      </Box>
    </Stack>
  );
}
