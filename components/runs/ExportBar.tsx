import { useState } from 'react';
import { Platform, StyleSheet, Text, View } from 'react-native';
import * as Clipboard from 'expo-clipboard';
import { useRouter } from 'expo-router';
import { runExportUrls } from '../queries/runs';
import { colors, fonts, radius, space, TOUCH } from '../theme';
import { Button } from '../ui/Button';
import { Small } from '../ui/Text';

const origin = () => (globalThis as { location?: { origin?: string } }).location?.origin ?? '';

/**
 * A file download as a real link: on the web react-native-web renders `href` + `hrefAttrs`
 * as <a download>, so the browser saves the file with the session cookie (no fetch, no blob).
 */
function DownloadLink(props: { href: string; fileName: string; label: string; testID?: string }) {
  const linkProps = Platform.OS === 'web' ? { href: props.href, hrefAttrs: { download: props.fileName, rel: 'noopener' } } : {};
  return (
    <Text accessibilityRole="link" accessibilityLabel={props.label} style={styles.link} testID={props.testID} {...(linkProps as object)}>
      {props.label}
    </Text>
  );
}

/** Exports and sharing for one run: assignment CSV, JSON report, printable page, member-only link. */
export function ExportBar(props: { runId: number; finished: boolean }) {
  const router = useRouter();
  const [copied, setCopied] = useState<string | null>(null);
  const urls = runExportUrls(props.runId);
  const copy = async () => {
    const url = `${origin()}/runs/${props.runId}`;
    try {
      await Clipboard.setStringAsync(url);
      setCopied(`Link copied: ${url} — it opens this read-only view for members of your organisation.`);
    } catch {
      setCopied(`Copy this link: ${url}`);
    }
  };
  return (
    <View style={styles.wrap} testID="export-bar">
      <View style={styles.row}>
        {props.finished ? (
          <>
            <DownloadLink href={urls.csv} fileName={`run-${props.runId}-assignment.csv`} label="Download assignment CSV" testID="download-csv" />
            <DownloadLink href={urls.json} fileName={`run-${props.runId}-report.json`} label="Download JSON report" testID="download-json" />
            <Button label="Printable report" tone="secondary" onPress={() => router.push(`/runs/${props.runId}/report`)} testID="open-report" />
          </>
        ) : null}
        <Button label="Copy link" tone="secondary" onPress={copy} testID="copy-link" />
      </View>
      {copied ? <Small accessibilityLiveRegion="polite" testID="copied">{copied}</Small> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  link: {
    minHeight: TOUCH,
    paddingHorizontal: space.lg,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
    color: colors.ink,
    fontFamily: fonts.semibold,
    fontSize: 15,
    lineHeight: TOUCH - 2,
    textAlign: 'center',
  },
});
