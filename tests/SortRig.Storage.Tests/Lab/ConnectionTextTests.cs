using SortRig.Storage.Lab;

namespace SortRig.Storage.Tests.Lab;

/// <summary>
/// Masking passwords in connection strings. Key syntax: ADO.NET connection strings (keys case-insensitive,
/// values optionally quoted, ';' separated; .NET DbConnectionStringBuilder documentation); Npgsql's keywords
/// Password, SSL Password (Npgsql connection string parameters page).
/// </summary>
public sealed class ConnectionTextTests
{
    [Theory]
    [InlineData("Host=lab-db;Username=bench;Password=s3cret-Pw", "s3cret-Pw")]
    [InlineData("host=lab-db;PASSWORD=s3cret-Pw;Database=sortrig", "s3cret-Pw")]
    [InlineData("Host=lab-db;Pwd='s3cret;Pw'", "s3cret;Pw")]
    [InlineData("Host=lab-db;SSL Password=key-s3cret;SSL Mode=VerifyFull", "key-s3cret")]
    public void Mask_HidesEveryPasswordAndKeepsTheRest(string text, string secret)
    {
        Assert.True(ConnectionText.HasPassword(text));
        var masked = ConnectionText.Mask(text);

        Assert.DoesNotContain(secret, masked, StringComparison.Ordinal);
        Assert.Contains("***", masked, StringComparison.Ordinal);
        Assert.Contains("lab-db", masked, StringComparison.OrdinalIgnoreCase);
        Assert.False(ConnectionText.HasPassword(masked.Replace("***", string.Empty, StringComparison.Ordinal)));
    }

    [Theory]
    [InlineData("Host=lab-db;Username=bench;Database=sortrig")]
    [InlineData("Host=lab-db;Username=bench;Passfile=/etc/sortrig/pgpass")]
    [InlineData("/var/lib/sortrig/precision.db")]
    [InlineData("Data Source=bench.db")]
    public void Mask_WithoutPassword_IsUnchangedInMeaning(string text)
    {
        Assert.False(ConnectionText.HasPassword(text));
        Assert.DoesNotContain("***", ConnectionText.Mask(text), StringComparison.Ordinal);
    }

    [Fact]
    public void Mask_StringThatDoesNotParse_IsNotShownAtAll()
    {
        // An unterminated quote: we cannot tell where a password would end, so nothing is shown.
        var masked = ConnectionText.Mask("Host=lab-db;Password='s3cret-Pw");

        Assert.DoesNotContain("s3cret", masked, StringComparison.Ordinal);
    }
}
