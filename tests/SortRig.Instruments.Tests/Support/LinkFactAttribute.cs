using System.Reflection;
using SortRig.Tests.Support;
using Xunit.Abstractions;
using Xunit.Sdk;

namespace SortRig.Instruments.Tests.Support;

/// <summary>Marks a link test class whose tests need socat.</summary>
[AttributeUsage(AttributeTargets.Class)]
internal sealed class RequiresSocatAttribute : Attribute;

/// <summary>
/// A fact on a contract test base class: runs in each concrete subclass, and is reported as
/// skipped (with the reason) in a subclass marked [RequiresSocat] when socat is absent and CI is not "true".
/// </summary>
[XunitTestCaseDiscoverer("SortRig.Instruments.Tests.Support.LinkFactDiscoverer", "SortRig.Instruments.Tests")]
[AttributeUsage(AttributeTargets.Method)]
public sealed class LinkFactAttribute : FactAttribute;

/// <summary>Discovers <see cref="LinkFactAttribute"/> tests per concrete class.</summary>
public sealed class LinkFactDiscoverer(IMessageSink diagnosticMessageSink) : IXunitTestCaseDiscoverer
{
    public IEnumerable<IXunitTestCase> Discover(
        ITestFrameworkDiscoveryOptions discoveryOptions,
        ITestMethod testMethod,
        IAttributeInfo factAttribute
    )
    {
        var display = discoveryOptions.MethodDisplayOrDefault();
        var displayOptions = discoveryOptions.MethodDisplayOptionsOrDefault();
        var needsSocat =
            testMethod.TestClass.Class.ToRuntimeType().GetCustomAttribute<RequiresSocatAttribute>() is not null;
        var reason = needsSocat ? SocatPair.SkipReason() : null;
        yield return reason is null
            ? new XunitTestCase(diagnosticMessageSink, display, displayOptions, testMethod)
            : new XunitSkippedDataRowTestCase(diagnosticMessageSink, display, displayOptions, testMethod, reason);
    }
}
