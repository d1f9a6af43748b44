using System.Diagnostics;
using System.Globalization;
using System.Text.RegularExpressions;
using SortRig.Host.Tests.Planning;
using SortRig.Host.Tests.Reliability.Support;
using SortRig.Storage;
using SortRig.Storage.Contracts;

namespace SortRig.Host.Tests.Typed;

/// <summary>
/// The meter with no computer link, end to end through a real pseudo-terminal: 20 parts typed off the display of the
/// invented hand-held (instruments/typed/handheld-typed.yaml, 50 kOhm range, one digit = 1 Ohm), with typos refused,
/// a part that wanders in the fingers asked again, Ctrl+C after part 8, the session resumed to part 20, and the pick
/// list of matched quads built from it by the plan verb.
/// </summary>
public sealed partial class TypedSortEndToEndTests
{
    // Invented reel (ohms): eight parts within 5 Ohm of one another (enough for two 0.1 % quads) among twelve others.
    private static readonly int[] s_reel =
    [
        10002,
        9941,
        10003,
        10004,
        10048,
        10006,
        9987,
        10005,
        10071,
        10003,
        9915,
        10030,
        10007,
        10019,
        9962,
        10002,
        10055,
        9990,
        10024,
        9933,
    ];

    private static readonly TimeSpan s_wait = TimeSpan.FromSeconds(60);

    [Fact]
    public async Task TwentyTypedParts_InterruptedAndResumed_SortedIntoCups_PickListBuilt()
    {
        Assert.True(PtyHost.Available, "util-linux script is needed for the pseudo-terminal");
        var dir = Directory.CreateTempSubdirectory("sortrig-typed-");
        try
        {
            string[] args =
            [
                "sort",
                "--resource",
                "TYPED::handheld-typed",
                "--db",
                "typed.db",
                "--session",
                "typed-reel",
                "--parts",
                "20",
                "--gap",
                "0.3",
                "--no-speech",
            ];
            var env = new Dictionary<string, string>();
            string[] resume;
            var seen = new List<string>();

            await using (var first = PtyHost.Start(dir.FullName, args, env))
            {
                var at = await first.WaitForAsync(
                    l => l.StartsWith("? range set on the meter", StringComparison.Ordinal),
                    0,
                    s_wait
                );
                Assert.Contains(first.Lines, l =>
                    l.Contains(
                        "set the meter to the 50 kOhm range (it shows up to 49.999 kOhm",
                        StringComparison.Ordinal
                    )
                );
                await first.TypeLineAsync("5k"); // too low a range for 10 kOhm parts: refused
                at = await first.WaitForAsync(
                    l => l.StartsWith("? set another range", StringComparison.Ordinal),
                    at + 1,
                    s_wait
                );
                Assert.Contains(first.Lines, l =>
                    l.Contains("would read overload: set the 50 kOhm range", StringComparison.Ordinal)
                );
                await first.TypeLineAsync("");
                for (var part = 1; part <= 8; part++)
                {
                    at = await TypePartAsync(first, part, at);
                }

                await first.WaitForAsync(l => l.StartsWith("? part 9:", StringComparison.Ordinal), at, s_wait);
                await first.CtrlCAsync();
                Assert.Equal(130, await first.WaitForExitAsync(s_wait));
                var hint = Assert.Single(first.Lines, l =>
                    l.StartsWith("to go on: sortrig sort", StringComparison.Ordinal)
                );
                Assert.Contains("--resource TYPED::handheld-typed", hint, StringComparison.Ordinal);
                resume = hint["to go on: sortrig ".Length..].Split(' ', StringSplitOptions.RemoveEmptyEntries);
                seen.AddRange(first.Lines);
            }

            // Carry on with the command the first run printed, as the operator would.
            await using (var second = PtyHost.Start(dir.FullName, resume, env))
            {
                var at = await second.WaitForAsync(
                    l => l.StartsWith("? range set on the meter", StringComparison.Ordinal),
                    0,
                    s_wait
                );
                Assert.Contains(second.Lines, l =>
                    l.Contains("resuming session 'typed-reel' at part 9", StringComparison.Ordinal)
                );
                await second.TypeLineAsync("50k");
                for (var part = 9; part <= 20; part++)
                {
                    at = await TypePartAsync(second, part, at);
                }

                Assert.Equal(0, await second.WaitForExitAsync(s_wait));
                seen.AddRange(second.Lines);
            }

            // Every part announced exactly once, across the interruption.
            var announced = seen.Select(l => CupLine().Match(l))
                .Where(m => m.Success)
                .Select(m => int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture))
                .ToList();
            Assert.Equal(Enumerable.Range(1, 20), announced);

            // Input checks: each typo got its own prompt to re-enter.
            Assert.Contains(seen, l => l.Contains("'10..003' has two decimal points", StringComparison.Ordinal));
            Assert.Contains(seen, l => l.Contains("'1o.006' has letters or signs in it", StringComparison.Ordinal));
            Assert.Contains(seen, l =>
                l.Contains(
                    "'100.05' (100.050 kOhm) is above what the 50 kOhm range shows (49.999 kOhm)",
                    StringComparison.Ordinal
                )
            );
            Assert.Contains(seen, l =>
                l.Contains("'1.000' (1.00000 kOhm) is 10 times below the nominal 10 kOhm", StringComparison.Ordinal)
            );
            Assert.Contains(seen, l =>
                l.Contains("'10.0031' has more digits than the 50 kOhm range shows", StringComparison.Ordinal)
            );
            Assert.Contains(seen, l =>
                l.Contains(
                    "the reading moved from 10.012 kOhm to 10.008 kOhm: let go of the part, wait a few seconds, read "
                        + "again",
                    StringComparison.Ordinal
                )
            );

            await CheckLogAsync(Path.Combine(dir.FullName, "typed.db"));
            await CheckPickListAsync(dir.FullName);
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    // Types one part: its script of entries, each after the previous verdict, a little more than the 0.3 s gap apart.
    private static async Task<int> TypePartAsync(PtyHost host, int part, int at)
    {
        var v = s_reel[part - 1];
        at = await host.WaitForAsync(
            l => l.StartsWith($"? part {part}: type the display", StringComparison.Ordinal),
            at,
            s_wait
        );
        foreach (var entry in Script(part, v))
        {
            await Task.Delay(400);
            await host.TypeLineAsync(entry);
            at = await host.WaitForAsync(
                l => l.StartsWith("? ", StringComparison.Ordinal) || CupLine().IsMatch(l),
                at + 1,
                s_wait
            );
        }

        Assert.Matches(CupLine(), host.Lines[at]);
        Assert.StartsWith($"part {part}: cup", host.Lines[at], StringComparison.Ordinal);
        return at + 1;
    }

    private static IEnumerable<string> Script(int part, int ohms)
    {
        var display = Kilo(ohms);
        switch (part)
        {
            case 2:
                yield return "10..003"; // two decimal points
                break;
            case 4:
                // Warm from the fingers: the value falls as the part cools, then holds (10.004 twice).
                yield return "10.012";
                yield return "10.008";
                break;
            case 5:
                yield return "1o.006"; // letter o for zero
                yield return "10.0031"; // a digit more than the display shows
                break;
            case 6:
                yield return "100.05"; // misplaced decimal point: off the range
                yield return "1.000"; // ten times below the nominal
                break;
        }

        yield return display;
        // Trade notation for the confirming entry of every third part ("10k005"), the display otherwise.
        yield return part % 3 == 0 ? display.Replace(".", "k", StringComparison.Ordinal) : display;
    }

    private static string Kilo(int ohms) => (ohms / 1000.0).ToString("F3", CultureInfo.InvariantCulture);

    private static async Task CheckLogAsync(string db)
    {
        await using var log = await PrecisionLogFactory.OpenAsync(
            db,
            new PrecisionLogOptions(),
            CancellationToken.None
        );
        var session = Assert.Single(await log.ListSessionsAsync(CancellationToken.None), s => s.Name == "typed-reel");
        var parts = await log.GetPartsAsync(session.Id, CancellationToken.None);
        Assert.Equal(Enumerable.Range(1, 20), parts.Select(p => p.Number).Order());
        foreach (var p in parts)
        {
            var typed = s_reel[p.Number - 1];
            Assert.Equal(PartState.Announced, p.State);
            Assert.True(p.Announced);
            Assert.Equal(typed, p.Value, 9);
            Assert.Equal(50_000, p.Range);
            Assert.NotNull(p.CupLabel);
            // GUM 4.3.7 by hand for a 1 Ohm digit and ±(0.06 % + 4 digits): u² = (0.5/√3)² + ((0.0006·R + 4)/√3)².
            var expected = Math.Sqrt((0.25 / 3) + (Math.Pow((0.0006 * typed) + 4, 2) / 3));
            Assert.Equal(expected, p.Measured.StandardUncertainty, 9);
            // Nothing refused reached the log: every stored reading is a checked entry of this part.
            var readings = await log.GetReadingsAsync(p.Id, CancellationToken.None);
            Assert.InRange(readings.Count, 2, 4);
            Assert.All(readings, r => Assert.InRange(r.Value, typed - 8, typed + 8));
            Assert.Equal(typed, readings[^1].Value);
        }
    }

    private static async Task CheckPickListAsync(string dir)
    {
        var start = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = dir,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            RedirectStandardInput = true,
            UseShellExecute = false,
        };
        foreach (
            var a in (string[])
                [
                    HostProcess.HostDll,
                    "plan",
                    "--db",
                    "typed.db",
                    "--session",
                    "typed-reel",
                    "--recipe",
                    PlanVerbTests.Recipe,
                    "--csv",
                    "picks.csv",
                    "--pick",
                    "parts",
                ]
        )
        {
            start.ArgumentList.Add(a);
        }

        using var process = Process.Start(start)!;
        var output = await process.StandardOutput.ReadToEndAsync();
        await process.WaitForExitAsync();
        Assert.True(process.ExitCode == 0, output + await process.StandardError.ReadToEndAsync());

        await using var log = await PrecisionLogFactory.OpenAsync(
            Path.Combine(dir, "typed.db"),
            new PrecisionLogOptions(),
            CancellationToken.None
        );
        var session = Assert.Single(await log.ListSessionsAsync(CancellationToken.None), s => s.Name == "typed-reel");
        var byId = (await log.GetPartsAsync(session.Id, CancellationToken.None)).ToDictionary(p =>
            p.Id.ToString(CultureInfo.InvariantCulture)
        );
        var sets = PlanVerbTests.ReadPickCsv(Path.Combine(dir, "picks.csv")).GroupBy(r => r.Set).ToList();
        // The reel holds eight parts within 5 Ohm (500 ppm) of one another: two quads at 0.1 % (matched-quad.yaml).
        Assert.Equal(2, sets.Count);
        foreach (var set in sets)
        {
            var values = set.Select(r => byId[r.Part].Value).ToList();
            Assert.Equal(4, values.Count);
            Assert.True((values.Max() / values.Min()) - 1 <= 0.001, string.Join(", ", values));
        }
    }

    [GeneratedRegex(@"^part (\d+): cup ")]
    private static partial Regex CupLine();
}
