import { useState } from 'react';
import { StyleSheet } from 'react-native';
import { ProfileSchema, type Me, type Profile } from '../../shared/schemas/auth';
import { useProfileMutation } from '../queries/auth';
import { space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { Heading, Small } from '../ui/Text';
import { useZodForm } from '../ui/useZodForm';

export function ProfileForm(props: { me: Me }) {
  const form = useZodForm(ProfileSchema, { name: props.me.user.name });
  const save = useProfileMutation();
  const [saved, setSaved] = useState(false);
  const submit = () => {
    setSaved(false);
    const body = form.validate() as Profile | null;
    if (body) save.mutate(body, { onSuccess: () => setSaved(true), onError: form.fromServer });
  };
  return (
    <Card style={styles.card} testID="profile-form">
      <Heading>Profile</Heading>
      <Small>Signed in as {props.me.user.email}</Small>
      {form.errors._ ? <Notice tone="error">{form.errors._}</Notice> : null}
      {saved ? <Notice tone="success">Name saved.</Notice> : null}
      <TextField label="Name" value={form.values.name} onChangeText={form.set('name')} error={form.errors.name} autoComplete="name" onSubmitEditing={submit} testID="profile-name" />
      <Button label="Save name" tone="secondary" onPress={submit} busy={save.isPending} />
    </Card>
  );
}

const styles = StyleSheet.create({ card: { gap: space.md } });
