import { CardSection } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { BusinessForm } from '../../features/business/components/business-form';
import { SitesEditor } from '../../features/sites/components/sites-editor';

export function SettingsRoute() {
  return (
    <div className="flex max-w-3xl flex-col gap-8">
      <PageHeader title="Settings" description="The business's details, how menu prices treat tax, and the sites you trade from." />
      <CardSection title="Business">
        <BusinessForm />
      </CardSection>
      <CardSection title="Sites">
        <SitesEditor />
      </CardSection>
    </div>
  );
}
