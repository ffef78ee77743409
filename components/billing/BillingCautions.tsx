import { StyleSheet, Text, View } from 'react-native';
import { colors, fonts, radius, space, type } from '../../constants/theme';

/** What an owner should know before paying or cancelling, said once and plainly. */
export function BillingCautions({ testMode }: { testMode: boolean }) {
  const lines = [
    testMode
      ? ['Test mode.', 'Payments go to a local test stand-in; no real money moves. Pay with the test card 4242 4242 4242 4242.']
      : ['Payments.', 'Card details go to the payment service only; Treadle never sees or stores a card number.'],
    ['Prices are before tax.', 'Any tax due is added on the invoice.'],
    ['Cancelling', 'keeps your plan until the end of the period you have paid for, then the studio moves to the free Solo plan. Nothing is deleted: whatever is over Solo’s limits becomes read-only until you are back under them or upgrade again.'],
  ];
  return (
    <View style={styles.box} aria-label="Before you pay">
      {lines.map(([lead, rest]) => (
        <Text key={lead} style={styles.line}>
          <Text style={styles.lead}>{lead} </Text>
          {rest}
        </Text>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { backgroundColor: colors.paperDeep, borderRadius: radius.sm, borderLeftWidth: 4, borderLeftColor: colors.ember, padding: space.md, gap: space.sm },
  line: { ...type.small, color: colors.ink },
  lead: { fontFamily: fonts.bodyStrong },
});
