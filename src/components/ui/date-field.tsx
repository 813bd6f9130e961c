import { useState, type ChangeEventHandler, type InputHTMLAttributes } from 'react';
import { ISO_DATE_PATTERN, ISO_DATE_TIME_PATTERN, readIsoDate, readIsoDateTime } from '../../lib/iso-date.ts';
import { localZoneName } from '../../lib/local-time.ts';
import { TextField } from './field.tsx';

type TextInputProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'type' | 'pattern' | 'value' | 'onChange'>;

interface IsoFieldProps extends TextInputProps {
  label: string;
  value: string;
  onChange: ChangeEventHandler<HTMLInputElement>;
  error?: string;
  hint?: string;
}

interface IsoFormat {
  pattern: string;
  placeholder: string;
  isValid: (text: string) => boolean;
  message: string;
}

const DATE_FORMAT: IsoFormat = {
  pattern: ISO_DATE_PATTERN,
  placeholder: 'yyyy-mm-dd',
  isValid: (text) => readIsoDate(text) !== null,
  message: 'Write the date as yyyy-mm-dd, e.g. 2026-12-03.',
};

const DATE_TIME_FORMAT: IsoFormat = {
  pattern: ISO_DATE_TIME_PATTERN,
  placeholder: 'yyyy-mm-dd hh:mm',
  isValid: (text) => readIsoDateTime(text) !== null,
  message: 'Write the time as yyyy-mm-dd hh:mm (24-hour), e.g. 2026-12-03 06:00.',
};

/** A text field for one ISO format: it says what it expects and, once left, whether the text fits. */
function IsoField({ format, label, value, onChange, error, hint, onBlur, ...input }: IsoFieldProps & { format: IsoFormat }) {
  const [left, setLeft] = useState(false);
  const ownError = left && value.trim() !== '' && !format.isValid(value) ? format.message : undefined;
  return (
    <TextField
      label={label}
      type="text"
      autoComplete="off"
      placeholder={format.placeholder}
      pattern={format.pattern}
      value={value}
      onChange={onChange}
      onBlur={(event) => {
        setLeft(true);
        onBlur?.(event);
      }}
      error={error ?? ownError}
      hint={hint ?? format.placeholder}
      {...input}
    />
  );
}

/** A day typed as yyyy-mm-dd (never the browser's locale order); read it with readIsoDate. */
export function DateField(props: IsoFieldProps) {
  return <IsoField format={DATE_FORMAT} {...props} />;
}

/** A local time typed as yyyy-mm-dd hh:mm, the reader's zone named in the hint; read it with readIsoDateTime. */
export function DateTimeField({ hint, ...props }: IsoFieldProps) {
  return <IsoField format={DATE_TIME_FORMAT} hint={hint ?? `yyyy-mm-dd hh:mm, your time (${localZoneName()})`} {...props} />;
}
