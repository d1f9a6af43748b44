// The engine's sessions run on a test-driven virtual clock (tests/Support/VirtualSort.cs, DriftRuns.cs), so the test
// classes run beside each other (xunit's default: one collection per class, as many at once as there are cores).
// The sessions that still run on a scaled wall clock (fault soaks, meter recovery, storage faults, reading continuity)
// are in ReliabilityCollection, which xunit runs on its own after the others, one test at a time.
[assembly: CollectionBehavior(CollectionBehavior.CollectionPerClass)]
