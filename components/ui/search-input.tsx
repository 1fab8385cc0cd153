"use client";

import { useEffect, useRef, useState } from "react";

/**
 * A search box that reports what was typed once the typing pauses, so a list is not asked
 * again for every key. Its own text stays responsive in the meantime.
 */
export function SearchInput({
  id,
  label,
  value,
  onSearch,
  placeholder,
  delayMs = 300,
}: {
  id: string;
  label: string;
  value: string;
  onSearch: (text: string) => void;
  placeholder?: string;
  delayMs?: number;
}) {
  const [text, setText] = useState(value);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  useEffect(
    () => () => {
      if (timer.current) clearTimeout(timer.current);
    },
    [],
  );
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <input
        id={id}
        type="search"
        className="field-input"
        value={text}
        placeholder={placeholder}
        autoComplete="off"
        onChange={(event) => {
          const next = event.target.value;
          setText(next);
          if (timer.current) clearTimeout(timer.current);
          timer.current = setTimeout(() => onSearch(next.trim()), delayMs);
        }}
        onKeyDown={(event) => {
          if (event.key !== "Enter") return;
          event.preventDefault();
          if (timer.current) clearTimeout(timer.current);
          onSearch(text.trim());
        }}
      />
    </div>
  );
}
