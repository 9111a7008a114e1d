// parse-prometheus-text-format ships no types; its output as its README documents it.
declare module 'parse-prometheus-text-format' {
  export interface Family {
    name: string;
    help: string;
    type: 'COUNTER' | 'GAUGE' | 'HISTOGRAM' | 'SUMMARY' | 'UNTYPED';
    metrics: Array<{ value?: string; labels?: Record<string, string>; buckets?: Record<string, string>; count?: string; sum?: string }>;
  }
  export default function parsePrometheusTextFormat(text: string): Family[];
}
