// The benchmark's workload digests (tests/bench/workloads.test.ts) run with the unit tests too: the
// unit project's include covers tests/unit, not tests/bench, and a drifting generator must fail CI.
import "../bench/workloads.test";
