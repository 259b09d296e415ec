import { Alert, Box, Button, DataList, Stack, Text } from '@chakra-ui/react';
import { Link as RouterLink, useNavigate, useParams } from 'react-router-dom';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { DateTime } from '@/components/ui/date-time';
import { LoadingState } from '@/components/ui/loading-state';
import { RoleBadge } from '@/components/ui/role-badge';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useInvitation } from '@/features/invitations/api/get-invitation';
import { JoinButton } from '@/features/invitations/components/join-button';
import { NewAccountForm } from '@/features/invitations/components/new-account-form';
import { useDocumentTitle } from '@/hooks/use-document-title';

/** Where the link in an invitation e-mail lands; open to people without an account. */
export function InvitationRoute() {
  useDocumentTitle('Invitation');
  const token = useParams().token ?? '';
  const invitation = useInvitation(token);
  const { data: me, isPending: mePending } = useMe();
  const navigate = useNavigate();
  const here = paths.invitation.getHref(token);

  if (invitation.isPending || mePending) {
    return (
      <AuthLayout title="Invitation" intro="Checking your invitation link…">
        <LoadingState label="Loading the invitation…" />
      </AuthLayout>
    );
  }
  if (invitation.isError) {
    return (
      <AuthLayout title="This invitation cannot be used" intro="The link did not lead to an open invitation.">
        <Stack gap="6">
          <Alert.Root status="warning" variant="subtle" borderRadius="md" role="alert">
            <Alert.Indicator />
            <Alert.Title fontWeight="400">{invitation.error.message}</Alert.Title>
          </Alert.Root>
          <Button asChild variant="outline" alignSelf="start">
            <RouterLink to={me ? paths.home.getHref() : paths.signIn.getHref()}>{me ? 'Go to the overview' : 'Sign in'}</RouterLink>
          </Button>
        </Stack>
      </AuthLayout>
    );
  }

  const data = invitation.data;
  const onJoined = () => navigate(paths.group.getHref(data.groupId), { replace: true });
  return (
    <AuthLayout title={`Join ${data.groupName}`} intro={`${data.invitedByName ?? 'A group lead'} invited ${data.email} to this group on Sixtyfold.`}>
      <Stack gap="6">
        <DataList.Root orientation="horizontal" size="sm">
          <DataList.Item>
            <DataList.ItemLabel>Group</DataList.ItemLabel>
            <DataList.ItemValue>{data.groupName}</DataList.ItemValue>
          </DataList.Item>
          <DataList.Item>
            <DataList.ItemLabel>Role</DataList.ItemLabel>
            <DataList.ItemValue>
              <RoleBadge role={data.role} />
            </DataList.ItemValue>
          </DataList.Item>
          <DataList.Item>
            <DataList.ItemLabel>Link valid until</DataList.ItemLabel>
            <DataList.ItemValue>
              <DateTime iso={data.expiresAt} />
            </DataList.ItemValue>
          </DataList.Item>
        </DataList.Root>
        {!data.accountExists ? (
          <NewAccountForm token={token} email={data.email} onJoined={onJoined} />
        ) : me?.email === data.email ? (
          <JoinButton token={token} groupName={data.groupName} onJoined={onJoined} />
        ) : (
          <Box>
            <Text mb="4">
              {me
                ? `You are signed in as ${me.email}. Sign out, then sign in as ${data.email} to join.`
                : `${data.email} already has a Sixtyfold account. Sign in first, and you come back here to join.`}
            </Text>
            {!me && (
              <Button asChild colorPalette="ember">
                <RouterLink to={paths.signIn.getHref(here)}>Sign in first</RouterLink>
              </Button>
            )}
          </Box>
        )}
      </Stack>
    </AuthLayout>
  );
}
