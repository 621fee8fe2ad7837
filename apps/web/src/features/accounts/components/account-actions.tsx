import { IconButton, Menu, Portal, Text } from '@chakra-ui/react';
import { MoreHorizontal } from 'lucide-react';
import { useState } from 'react';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { toaster } from '@/components/ui/toaster';
import { GLOBAL_ROLES, type Account, type GlobalRole } from '../api';
import { useResendVerification, useUpdateAccount } from '../hooks';
import { ROLE_LABELS } from '../labels';

/** What an admin can do to one account: roles, deactivation, a new confirmation link. */
export function AccountActions({ account, isSelf }: { account: Account; isSelf: boolean }) {
  const update = useUpdateAccount();
  const resend = useResendVerification();
  const [confirming, setConfirming] = useState(false);

  const failed = (error: Error) => toaster.create({ type: 'error', title: error.message });
  const toggleRole = (role: GlobalRole) => {
    const has = account.globalRoles.includes(role);
    const roles = has
      ? account.globalRoles.filter((r) => r !== role)
      : [...account.globalRoles, role];
    update.mutate(
      { id: account.id, change: { roles } },
      {
        onSuccess: () =>
          toaster.create({
            type: 'success',
            title: `${account.name} ${has ? 'no longer has' : 'now has'} the ${ROLE_LABELS[role].toLowerCase()} role`,
          }),
        onError: failed,
      },
    );
  };
  const setActive = (active: boolean) =>
    update.mutate(
      { id: account.id, change: { active } },
      {
        onSuccess: () => {
          setConfirming(false);
          toaster.create({
            type: 'success',
            title: `${account.name} is ${active ? 'reactivated' : 'deactivated'}`,
          });
        },
        onError: active ? failed : undefined,
      },
    );

  return (
    <>
      <Menu.Root positioning={{ placement: 'bottom-end' }}>
        <Menu.Trigger asChild>
          <IconButton variant="ghost" size="sm" aria-label={`Actions for ${account.name}`}>
            <MoreHorizontal aria-hidden />
          </IconButton>
        </Menu.Trigger>
        <Portal>
          <Menu.Positioner>
            <Menu.Content minW="14rem">
              {GLOBAL_ROLES.map((role) => {
                const has = account.globalRoles.includes(role);
                // An admin keeps their own admin role (the server refuses it too).
                const locked = isSelf && role === 'admin' && has;
                return (
                  <Menu.Item
                    key={role}
                    value={`role-${role}`}
                    disabled={locked || update.isPending}
                    onSelect={() => toggleRole(role)}
                  >
                    {has
                      ? `Take away ${ROLE_LABELS[role].toLowerCase()} role`
                      : `Give ${ROLE_LABELS[role].toLowerCase()} role`}
                  </Menu.Item>
                );
              })}
              {!account.emailVerified && (
                <Menu.Item
                  value="resend"
                  disabled={resend.isPending || !account.active}
                  onSelect={() =>
                    resend.mutate(account.id, {
                      onSuccess: () =>
                        toaster.create({
                          type: 'success',
                          title: `A new confirmation link is on its way to ${account.email}`,
                        }),
                      onError: failed,
                    })
                  }
                >
                  Send a new confirmation link
                </Menu.Item>
              )}
              <Menu.Separator />
              {account.active ? (
                <Menu.Item
                  value="deactivate"
                  color="blocker.fg"
                  disabled={isSelf}
                  onSelect={() => {
                    update.reset();
                    setConfirming(true);
                  }}
                >
                  Deactivate…
                </Menu.Item>
              ) : (
                <Menu.Item value="reactivate" onSelect={() => setActive(true)}>
                  Reactivate
                </Menu.Item>
              )}
            </Menu.Content>
          </Menu.Positioner>
        </Portal>
      </Menu.Root>
      <ConfirmDialog
        open={confirming}
        onOpenChange={setConfirming}
        tone="danger"
        title={`Deactivate ${account.name}?`}
        confirmLabel="Deactivate"
        pending={update.isPending}
        error={update.error?.message}
        onConfirm={() => setActive(false)}
      >
        <Text>
          {account.email} is signed out everywhere at once and cannot sign in until you reactivate
          the account. Nothing they wrote is deleted.
        </Text>
      </ConfirmDialog>
    </>
  );
}
