export { Button, LinkButton, buttonClasses, type ButtonProps, type LinkButtonProps, type ButtonVariant, type ButtonSize } from "./Button";
export { Field, Input, Select, Textarea, type FieldProps, type InputProps, type SelectProps, type TextareaProps } from "./Field";
export { Card, type CardProps } from "./Card";
export { Badge, type BadgeTone } from "./Badge";
export { Alert, Notice, type AlertTone } from "./Alert";
export { EmptyState } from "./EmptyState";
export { Spinner } from "./Spinner";
export { ThemeToggle, THEME_KEY, type Theme } from "./ThemeToggle";
export { cx } from "./cx";
