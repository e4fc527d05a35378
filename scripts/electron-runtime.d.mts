export function electronBinary():
  { available: true; binary: string; reason?: undefined } | { available: false; reason: string; binary?: undefined };
