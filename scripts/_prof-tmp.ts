import Papa from "papaparse";
import { analyzeLog } from "../analysis/index";
import { importLog } from "../analysis/decay/import";
import { generateShapedLog } from "./bench-shapes";
const text = generateShapedLog(process.argv[2] ?? "TSV quoted, mm:ss past 59, thousands", 500_000);
const cpu = (f: () => void) => { const c = process.cpuUsage(); f(); const d = process.cpuUsage(c); return ((d.user + d.system) / 1000).toFixed(0); };
for (let k = 0; k < 5; k++) console.log(cpu(() => Papa.parse(text)), cpu(() => Papa.parse(text, { delimiter: "\t", newline: "\n" })), cpu(() => Papa.parse(text, { delimiter: "\t", newline: "\n", chunkSize: 1 << 18, chunk: () => {} } as never)), cpu(() => importLog(text)), cpu(() => analyzeLog(text)));
