using System.Globalization;
using SortRig.Engine.Announcing;
using SortRig.Engine.Building;
using SortRig.Engine.Events;
using SortRig.Engine.Picking;
using SortRig.Planning.Assembly;
using SortRig.Planning.Cups;
using SortRig.Planning.PickLists;
using SortRig.Planning.Recipes;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    // The check's search budget: exact on small sets of parts while few assignments need judging (a network recipe's
    // exact enumeration ignores the time limit, so it is capped), else the sweep and a short neighbourhood search.
    private static readonly TimeSpan s_buildSearchLimit = TimeSpan.FromMilliseconds(300);
    private const int BuildExactSetLimit = 20_000;

    private BuildTarget? _target;
    private BuildCheck? _buildCheck;
    private BuildStatus? _buildStatus;
    private string? _buildCsv;

    private bool SetsComplete => _buildStatus?.Complete == true;

    private BuildCheck? Build =>
        _target is { } target
            ? _buildCheck ??= new BuildCheck(
                target,
                new AssemblyOptions(exactSetLimit: BuildExactSetLimit, timeLimit: s_buildSearchLimit),
                Options.StockTolerance
            )
            : null;

    /// <summary>How the build ended, for the outcome; null without a target.</summary>
    private BuildReport? BuildOutcome =>
        _target is { } t && _buildStatus is { } s
            ? new BuildReport(t.Recipe.Name, t.Sets, s.Complete, s.Line(), _buildCsv) { Plan = s.Plan }
            : null;

    // The target given now is kept with the session (replacing an earlier one); without one, a session that has a
    // stored target resumes toward it. A stored target that does not take this batch's nominal is not applied. A new
    // session has none, so the log is asked only on a resume.
    private async Task ResolveBuildTargetAsync(bool resumed, CancellationToken ct)
    {
        var given = _ctx.Build;
        var stored = resumed
            ? await DurablyAsync("reading the build target", c => _ctx.Log.GetBuildTargetAsync(_session.Id, c), ct)
                .ConfigureAwait(false)
            : null;
        if (given is not null)
        {
            var record = BuildTargets.ToRecord(given);
            if (record != stored && given.RecipeYaml.Length > 0)
            {
                await DurablyAsync(
                        "the build target",
                        async c =>
                        {
                            await _ctx.Log.SetBuildTargetAsync(_session.Id, record, c).ConfigureAwait(false);
                            return true;
                        },
                        ct
                    )
                    .ConfigureAwait(false);
            }

            _target = given;
        }
        else if (stored is not null)
        {
            BuildTarget kept;
            try
            {
                kept = BuildTargets.FromRecord(stored);
            }
            catch (RecipeException e)
            {
                await SayAsync(
                        string.Create(
                            CultureInfo.InvariantCulture,
                            $"the build target stored with this session cannot be read ({e.Message}); sorting "
                                + $"without it"
                        ),
                        ct
                    )
                    .ConfigureAwait(false);
                return;
            }

            if (!PlanParts.Wanted(Options.Nominal, kept.Recipe, new AssemblyOptions()))
            {
                await SayAsync(
                        string.Create(
                            CultureInfo.InvariantCulture,
                            $"this session sorts toward {stored.Sets} set(s) of {stored.RecipeName}, which takes no "
                                + $"{BuildStatus.Ohms(Options.Nominal)} parts; sorting this batch without the target"
                        ),
                        ct
                    )
                    .ConfigureAwait(false);
                return;
            }

            _target = kept;
            await SayAsync(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"resuming toward {stored.Sets} set(s) of {stored.RecipeName} (kept with the session)"
                    ),
                    ct
                )
                .ConfigureAwait(false);
        }

        if (_ctx.Cups is BuildCupAssigner cups)
        {
            cups.Target = _target;
        }
    }

    // After a part is logged (or when the session opens): ask whether the sets are in hand; if so, say so, export the
    // pick list and let the loop finish; else publish the guidance. A part turned away is said plainly first.
    private async Task CheckBuildAsync(PartRecord? part, CancellationToken ct)
    {
        if (Build is not { } check)
        {
            return;
        }

        if (
            part is not null
            && (part.CupLabel ?? part.SlotLabel) == CupLabels.Reject
            && _ctx.Cups is BuildCupAssigner { LastReason.Length: > 0 } b
        )
        {
            var why = b.LastReason;
            var where = Options.Assigner == AssignerKind.Slots ? "put it back in the bag" : "put it in the reject cup";
            await SayAsync(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"part {part.Number} cannot help the build ({why}): {where}; it stays in the log"
                    ),
                    ct
                )
                .ConfigureAwait(false);
        }

        var parts = await DurablyAsync("reading the session's parts", c => _ctx.Log.GetPartsAsync(_session.Id, c), ct)
            .ConfigureAwait(false);
        var status = check.Evaluate(parts, Options.Nominal);
        _buildStatus = status;
        if (!status.Complete)
        {
            _ctx.Hub.Publish(new BenchEvent(0, BenchEventKind.Notice, default, State: "build", Text: status.Line()));
            return;
        }

        _buildCsv = _target!.CsvPath;
        if (_buildCsv is not null)
        {
            await using var file = new StreamWriter(_buildCsv, append: false);
            PickListCsv.Write(file, status.Plan!.List);
        }

        var where2 =
            status.Plan!.List.Source == PickSource.Cups ? "by cup"
            : Options.Assigner == AssignerKind.Slots ? "by slot"
            : "by part";
        var csv = _buildCsv is null ? "" : $"; pick list written to {_buildCsv}";
        await SayAsync(
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"sets complete: {status.Target.Sets} set(s) of {status.Target.Recipe.Name} are in hand after "
                        + $"{parts.Count} part(s); stop feeding and pick them {where2}{csv}"
                ),
                ct
            )
            .ConfigureAwait(false);
        _ctx.Hub.Publish(new BenchEvent(0, BenchEventKind.Notice, default, State: "build", Text: status.Line()));
    }
}
