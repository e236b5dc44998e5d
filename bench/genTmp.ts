import {writeLongCsv} from "./longCsv.ts";
console.log(await writeLongCsv(process.argv[2], {embryos: Number(process.argv[3]), points: 500, seed: 1}));
