using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;
using Npgsql;
using SortRig.Storage.Contracts;
using SortRig.Storage.Lab;
using SortRig.Storage.Tests.Contracts;

namespace SortRig.Storage.Tests.Lab;

/// <summary>
/// Passwords on a real server with password authentication (scripts/pg-test-server makes members of
/// sortrig_password_auth log in with scram-sha-256, RFC 7677) and TLS (PostgreSQL 15 manual sec. 19.9, 34.19
/// sslmode): the password comes from a passfile (libpq's ~/.pgpass format, manual sec. 34.16) and never reaches a
/// log line or an exception message.
/// </summary>
public sealed class LabSecretsTests : IAsyncLifetime
{
    private readonly LabRoleNames _names = new(LabServer.Name("lo"), LabServer.Name("lw"), LabServer.Name("lab"));
    private readonly string _password = "Pw-" + Guid.NewGuid().ToString("N");
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-lab-").FullName;

    public Task InitializeAsync() => Task.CompletedTask;

    public async Task DisposeAsync()
    {
        if (!string.IsNullOrWhiteSpace(Environment.GetEnvironmentVariable("SORTRIG_TEST_PG")))
        {
            NpgsqlConnection.ClearAllPools();
            await LabServer.DropLabAsync(_names.Schema, _names.Owner, _names.Writer);
        }

        Directory.Delete(_dir, recursive: true);
    }

    [SkippableFact]
    public async Task Writer_WithPasswordFromPassfile_Works_WithoutIt_IsRefused_AndThePasswordIsInNoLogLine()
    {
        await SetUpPasswordLabAsync();
        var server = new NpgsqlConnectionStringBuilder(LabServer.ConnectionString());
        var passfile = Path.Combine(_dir, "pgpass");
        await File.WriteAllTextAsync(
            passfile,
            $"{server.Host}:{server.Port}:{server.Database}:{_names.Writer}:{_password}\n"
        );
        // libpq ignores a group/world-readable passfile
        File.SetUnixFileMode(passfile, UnixFileMode.UserRead | UnixFileMode.UserWrite);
        var logs = new CapturingLoggerFactory();
        var options = new PrecisionLogOptions { LoggerFactory = logs };

        // No password at all: refused by the server, and said so.
        var refused = await Assert.ThrowsAnyAsync<Exception>(() =>
            PrecisionLogFactory.OpenAsync(LabServer.As(_names.Writer), options, CancellationToken.None)
        );
        Assert.DoesNotContain(_password, refused.ToString(), StringComparison.Ordinal);

        // A wrong password: the server says authentication failed; neither password shows anywhere.
        var wrong = await Assert.ThrowsAsync<StorageException>(() =>
            PrecisionLogFactory.OpenAsync(
                LabServer.As(_names.Writer, ";Password=not-" + _password),
                options,
                CancellationToken.None
            )
        );
        Assert.Equal(StorageFault.Unavailable, wrong.Fault);
        Assert.DoesNotContain(_password, wrong.ToString(), StringComparison.Ordinal);

        // From the passfile: works.
        await using (
            var bench = await PrecisionLogFactory.OpenAsync(
                LabServer.As(_names.Writer, $";Passfile={passfile}"),
                options,
                CancellationToken.None
            )
        )
        {
            var (session, batch) = await Bench.StartAsync(bench, "lab-passfile");
            await Bench.CommitAsync(bench, session.Session.Id, batch, Bench.TenKAt(-40));
        }

        // In the connection string itself (from SORTRIG_Sort__Database or appsettings.json): works, and a write the
        // server refuses (a read-only transaction) is logged as a fault without the password.
        var readOnly = LabServer.As(
            _names.Writer,
            $";Password={_password};Options=-c default_transaction_read_only=on"
        );
        await using (var bench = await PrecisionLogFactory.OpenAsync(readOnly, options, CancellationToken.None))
        {
            var error = await Assert.ThrowsAsync<StorageException>(() =>
                bench.OpenOrResumeSessionAsync(new SessionRequest("lab-read-only"), CancellationToken.None)
            );
            Assert.Equal(StorageFault.ReadOnly, error.Fault);
            Assert.DoesNotContain(_password, error.ToString(), StringComparison.Ordinal);
        }

        Assert.NotEmpty(logs.Lines);
        Assert.Contains(logs.Lines, l => l.Contains("Opened PostgreSQL precision log", StringComparison.Ordinal));
        Assert.Contains(logs.Lines, l => l.Contains("failed with ReadOnly", StringComparison.Ordinal));
        Assert.DoesNotContain(logs.Lines, l => l.Contains(_password, StringComparison.Ordinal));
    }

    [SkippableFact]
    public async Task Tls_RequireAndVerifyFull_ConnectEncrypted()
    {
        var admin = LabServer.ConnectionString();
        Skip.If(
            (string?)await LabServer.ScalarAsync(admin, "SHOW ssl") != "on",
            "the test server has no certificate (openssl missing when scripts/pg-test-server made it); TLS not tested"
        );
        var dataDir = (string)(await LabServer.ScalarAsync(admin, "SHOW data_directory"))!;
        var certFile = (string)(await LabServer.ScalarAsync(admin, "SHOW ssl_cert_file"))!;
        var rootCert = Path.IsPathRooted(certFile) ? certFile : Path.Combine(dataDir, certFile);

        await LabServer.ExecuteAsync(admin, $"CREATE SCHEMA {_names.Schema}");
        foreach (var tls in new[] { ";SSL Mode=Require", $";SSL Mode=VerifyFull;Root Certificate={rootCert}" })
        {
            await using var log = await PrecisionLogFactory.OpenAsync(
                admin + $";Search Path={_names.Schema}" + tls,
                null,
                CancellationToken.None
            );
            Assert.Equal(StorageEngine.Postgres, log.Engine);
            Assert.Equal(
                true,
                await LabServer.ScalarAsync(admin + tls, "SELECT ssl FROM pg_stat_ssl WHERE pid = pg_backend_pid()")
            );
        }

        // The certificate is checked under VerifyFull: a different root does not vouch for the server.
        var otherRoot = Path.Combine(_dir, "other.crt");
        using (var key = RSA.Create(2048))
        {
            var request = new CertificateRequest(
                "CN=unrelated.invalid",
                key,
                HashAlgorithmName.SHA256,
                RSASignaturePadding.Pkcs1
            );
            using var other = request.CreateSelfSigned(
                new DateTimeOffset(2020, 1, 1, 0, 0, 0, TimeSpan.Zero),
                new DateTimeOffset(2099, 1, 1, 0, 0, 0, TimeSpan.Zero)
            );
            await File.WriteAllTextAsync(otherRoot, other.ExportCertificatePem());
        }

        await Assert.ThrowsAnyAsync<Exception>(() =>
            LabServer.ScalarAsync(admin + $";SSL Mode=VerifyFull;Root Certificate={otherRoot}", "SELECT 1")
        );
    }

    private async Task SetUpPasswordLabAsync()
    {
        var admin = LabServer.ConnectionString();
        var hba = (long)
            (
                await LabServer.ScalarAsync(
                    admin,
                    "SELECT COUNT(*) FROM pg_hba_file_rules WHERE '+sortrig_password_auth' = ANY(user_name) AND "
                        + "auth_method = 'scram-sha-256'"
                )
            )!;
        Skip.If(
            hba == 0,
            "the test server does not ask sortrig_password_auth members for a password (made by an older "
                + "scripts/pg-test-server)"
        );
        await LabRoles.ApplyAsync(admin, _names, CancellationToken.None);
        await using (await PrecisionLogFactory.OpenAsync(LabServer.As(_names.Owner), null, CancellationToken.None))
        {
            // The owner migrates the lab schema.
        }

        // The password is set over the connection as a parameter-free statement built here from a GUID, like a keeper's
        // \password.
        await LabServer.ExecuteAsync(admin, $"ALTER ROLE {_names.Writer} PASSWORD '{_password}'");
        await LabServer.ExecuteAsync(admin, $"GRANT sortrig_password_auth TO {_names.Writer}");
    }
}
