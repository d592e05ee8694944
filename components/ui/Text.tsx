import { Text, type TextProps } from 'react-native';
import { type as typo } from '../theme';

export const Title = (p: TextProps) => <Text accessibilityRole="header" {...p} style={[typo.title, p.style]} />;
export const Heading = (p: TextProps) => <Text accessibilityRole="header" {...p} style={[typo.heading, p.style]} />;
export const Body = (p: TextProps) => <Text {...p} style={[typo.body, p.style]} />;
export const Small = (p: TextProps) => <Text {...p} style={[typo.small, p.style]} />;
export const Label = (p: TextProps) => <Text {...p} style={[typo.label, p.style]} />;
