using System.Globalization;
using SortRig.Instruments.Profiles;
using SortRig.Instruments.Scpi;

namespace SortRig.Instruments.Drivers;

/// <summary>
/// Checks that a meter behaves as its profile says: identity, every range, every NPLC setting,
/// 4-wire, the read and init/fetch commands, and an empty error queue at the end. Used by the
/// CLI probe verb. Leaves the session open; the meter is left on the last setup tried.
/// </summary>
public sealed class ProfileCheck
{
    private readonly TimeProvider _time;

    /// <summary>Creates the check; <paramref name="time"/> paces settle waits (default system).</summary>
    public ProfileCheck(TimeProvider? time = null) => _time = time ?? TimeProvider.System;

    /// <summary>Runs every check and returns one row per check; never throws for instrument faults.</summary>
    public async Task<ProfileCheckReport> RunAsync(ScpiSession session, MeterProfile profile, CancellationToken ct)
    {
        var rows = new List<ProfileCheckRow>();
        var meter = new ScpiResistanceMeter(session, profile, _time);
        InstrumentIdentity? identity = null;
        var twoWire = profile.TwoWire;
        var nplc = profile.Spec.Nplcs[profile.Spec.Nplcs.Count / 2].Nplc;
        var midRange = profile.Spec.Ranges[profile.Spec.Ranges.Count / 2].FullScale;

        var configured = false; // the driver reads only after a configuration it verified
        async Task<string> Configure(ResistanceSetup setup)
        {
            configured = false;
            var done = await ProfileCheck.Configure(meter, setup, ct).ConfigureAwait(false);
            configured = true;
            return done;
        }

        async Task Step(string check, Func<Task<string>> action)
        {
            if (session.IsBroken)
            {
                rows.Add(new ProfileCheckRow(check, CheckOutcome.Skipped, "session broken by an earlier fault"));
                return;
            }

            try
            {
                rows.Add(new ProfileCheckRow(check, CheckOutcome.Pass, await action().ConfigureAwait(false)));
            }
            catch (InstrumentException ex)
            {
                rows.Add(new ProfileCheckRow(check, CheckOutcome.Fail, ex.Message));
            }
        }

        await Step("clear status (*CLS)", async () =>
            {
                await session.ClearStatusAsync(ct).ConfigureAwait(false);
                return "sent";
            })
            .ConfigureAwait(false);
        await Step("identify (*IDN?)", async () =>
                (identity = await session.IdentifyAsync(ct).ConfigureAwait(false)).ToString()
            )
            .ConfigureAwait(false);
        rows.Add(
            identity is null
                ? new ProfileCheckRow("model matches profile", CheckOutcome.Skipped, "no identity")
                : new ProfileCheckRow(
                    "model matches profile",
                    profile.MatchesModel(identity.Model) ? CheckOutcome.Pass : CheckOutcome.Fail,
                    $"'{identity.Model}' against /{profile.ModelPattern}/"
                )
        );

        foreach (var range in profile.Spec.Ranges)
        {
            await Step($"range {Text(range.FullScale)} ohm", () =>
                    Configure(new ResistanceSetup(range.FullScale, nplc, !twoWire))
                )
                .ConfigureAwait(false);
        }

        foreach (var setting in profile.Spec.Nplcs)
        {
            await Step($"NPLC {Text(setting.Nplc)}", () =>
                    Configure(new ResistanceSetup(midRange, setting.Nplc, !twoWire))
                )
                .ConfigureAwait(false);
        }

        if (twoWire && profile.Spec.FourWire)
        {
            await Step("4-wire", () => Configure(new ResistanceSetup(midRange, nplc, true))).ConfigureAwait(false);
        }

        if (configured)
        {
            await Step($"read ({profile.Commands.Read})", async () =>
                    Describe(await meter.ReadAsync(ct).ConfigureAwait(false))
                )
                .ConfigureAwait(false);
        }
        else
        {
            rows.Add(
                new ProfileCheckRow(
                    $"read ({profile.Commands.Read})",
                    CheckOutcome.Skipped,
                    "skipped: the last configuration step failed"
                )
            );
        }
        if (profile.Commands is { Init: { } init, Fetch: { } fetch })
        {
            await Step($"init/fetch ({init}, {fetch})", async () =>
                {
                    await session.WriteAsync(init.Text, ct).ConfigureAwait(false);
                    return Text((await session.QueryNumberAsync(fetch.Text, ct).ConfigureAwait(false)).Value);
                })
                .ConfigureAwait(false);
        }
        else
        {
            rows.Add(new ProfileCheckRow("init/fetch", CheckOutcome.Skipped, "profile has no init/fetch templates"));
        }

        await Step("error queue empty", async () =>
            {
                var (errors, commands) = await session.DrainErrorsAsync(ct).ConfigureAwait(false);
                return errors.Count == 0
                    ? "no error"
                    : throw new ScpiInstrumentException(errors[0].Code, errors[0].Message, commands, errors);
            })
            .ConfigureAwait(false);
        return new ProfileCheckReport(profile.Family, session.Endpoint, identity, rows);
    }

    private static async Task<string> Configure(ScpiResistanceMeter meter, ResistanceSetup setup, CancellationToken ct)
    {
        await meter.ConfigureAsync(setup, ct).ConfigureAwait(false);
        return $"read back range {Text(setup.Range)} ohm, NPLC {Text(setup.Nplc)}, {(setup.FourWire ? 4 : 2)}-wire";
    }

    private static string Describe(Measurement.Readings.Reading r) =>
        r.IsFinite ? $"{Text(r.Value)} ohm" : "overload (9.9E37): open input?";

    private static string Text(double v) => v.ToString("G7", CultureInfo.InvariantCulture);
}
